/**
 * Writing values as text: engineering notation with SI prefixes and IEC 60062 RKM codes. Works on
 * decimal digit strings (from toExponential) so no binary noise reaches the output. Import these
 * through values.ts, the public surface for values.
 */

/** Significant digits as a whole number in 1..15. */
function sigDigits(digits: number | undefined): number {
  return Number.isFinite(digits) ? Math.min(15, Math.max(1, Math.round(digits as number))) : 3;
}

/** The digits of |value| rounded to `digits` significant figures, and the power of ten of the first. */
function decompose(value: number, digits: number): { ds: string; exp: number } {
  const [mant, exp] = Math.abs(value).toExponential(digits - 1).split('e');
  return { ds: mant.replace('.', ''), exp: Number(exp) };
}

/** Splits a digit string so that `count` digits come before the decimal point (count may be ≤ 0). */
function split(ds: string, count: number): { int: string; frac: string } {
  if (count <= 0) return { int: '', frac: '0'.repeat(-count) + ds };
  const padded = ds.padEnd(count, '0');
  return { int: padded.slice(0, count), frac: padded.slice(count) };
}

const ENG_PREFIX: Record<number, string> = {
  [-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'µ', [-3]: 'm', 0: '', 3: 'k', 6: 'M', 9: 'G', 12: 'T',
};

/** Unit symbols that take SI prefixes; any other unit (%, °C, m of level, ...) is written plainly. */
const PREFIXABLE = new Set(['', 'V', 'A', 'Ω', 'Ω', 'ohm', 'W', 'F', 'Hz', 's', 'Ah', 'Wh', 'J']);

/** Whether `unit` takes SI prefixes (V, A, Ω, W, F, ...); %, °C and other units do not. */
export function takesSiPrefix(unit: string): boolean {
  return PREFIXABLE.has(unit);
}

/**
 * A number in the style of `unit` but without it: engineering prefix for units that take one
 * ("99.4m" for volts), plain decimals otherwise ("0.180" for %). For table cells whose column title
 * names the unit.
 */
export function formatBare(value: number, unit: string, opts: { digits?: number; ascii?: boolean } = {}): string {
  if (takesSiPrefix(unit) || !Number.isFinite(value) || value === 0) return formatEng(value, '', opts);
  return plainDecimal(value, sigDigits(opts.digits));
}

/** `value` to `digits` significant figures in plain decimal notation (no exponent, no prefix). */
function plainDecimal(value: number, digits: number): string {
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.min(20, Math.max(0, digits - 1 - magnitude));
  return value.toFixed(decimals);
}

/**
 * Engineering notation with an SI prefix: `formatEng(4700, 'Ω')` is "4.70 kΩ", 470e-6 A is
 * "470 µA", 0 V is "0 V". `value` is in SI units of `unit`, an unprefixed symbol ("Ω", "V", "A",
 * "W", "F"; "" gives "4.70k"; units that take no SI prefix, such as "%" or "°C", are written
 * in plain decimals: 0.258 % stays "0.258 %"); `digits` significant figures (default
 * 3, trailing zeros kept); `ascii` writes u for µ and ohm for Ω. Non-finite values give "—" ("-"
 * in ascii). Magnitudes outside femto..tera fall back to exponent notation.
 */
export function formatEng(value: number, unit: string, opts: { digits?: number; ascii?: boolean } = {}): string {
  const ascii = opts.ascii ?? false;
  if (!Number.isFinite(value)) return ascii ? '-' : '—';
  const digits = sigDigits(opts.digits);
  const symbol = ascii ? unit.replace(/[ΩΩ]/g, 'ohm').replace(/[µμ]/g, 'u') : unit;
  const gap = symbol ? ' ' : '';
  if (value === 0) return `0${gap}${symbol}`;
  if (!PREFIXABLE.has(unit)) return `${plainDecimal(value, digits)}${gap}${symbol}`;
  const { ds, exp } = decompose(value, digits);
  const eng = Math.floor(exp / 3) * 3;
  if (!(eng in ENG_PREFIX)) return `${value.toExponential(digits - 1)}${gap}${symbol}`;
  const { int, frac } = split(ds, exp - eng + 1);
  const prefix = ascii && eng === -6 ? 'u' : ENG_PREFIX[eng];
  const sign = value < 0 ? '-' : '';
  return `${sign}${int}${frac ? `.${frac}` : ''}${gap}${prefix}${symbol}`;
}

const RKM_LETTER: Record<number, string> = { 0: 'R', 3: 'k', 6: 'M', 9: 'G', 12: 'T' };

/**
 * The IEC 60062 RKM code of a resistance in ohms, rounded to `digits` significant figures
 * (default 3): 4700 -> "4k7", 2.2 -> "2R2", 0.47 -> "R47", 100e3 -> "100k", 10 -> "10R",
 * 1e6 -> "1M0", 1.02e3 -> "1k02". The letter stands where the decimal point would; trailing zeros
 * after it are dropped, but every code keeps at least two digits ("1M0", "R10"). parseValue reads
 * every code back to the same number. Values ≤ 0 or non-finite give "-".
 */
export function formatRkm(ohms: number, digits?: number): string {
  if (!Number.isFinite(ohms) || ohms <= 0) return '-';
  const { ds, exp } = decompose(ohms, sigDigits(digits));
  const group = exp < 0 ? 0 : Math.min(12, Math.floor(exp / 3) * 3);
  const { int, frac: raw } = split(ds, exp - group + 1);
  let frac = raw.replace(/0+$/, '');
  while (int.length + frac.length < 2) frac += '0';
  return `${int}${RKM_LETTER[group]}${frac}`;
}
