/**
 * Reading and writing component values. Unit names and wrong units ("3 volts", or "5 mA" where ohms
 * are expected) go to the unit reader (mathjs, in unit-reader.ts, loaded on first need). Everything
 * returned is a plain SI number; text is only produced by the format functions (re-exported here
 * from value-format.ts, which needs no mathjs).
 */
import type { UnitReader } from './unit-reader';

export { formatBare, formatEng, formatRkm, takesSiPrefix } from './value-format.js';

/**
 * The unit reader (a mathjs instance), null until `loadUnitReader` has finished. Loading mathjs
 * takes longer than the rest of start-up, and almost every value is read without it (plain numbers,
 * RKM codes, SI prefixes and the unit's own symbol), so it is loaded only when some text needs it.
 */
let reader: UnitReader | null = null;
let loading: Promise<void> | null = null;
/** How many reads have needed the unit reader before it was loaded (see `withUnitReader`). */
let misses = 0;

/** Loads the unit reader; every call shares one load. Resolves when `parseValue` can use it. */
export function loadUnitReader(): Promise<void> {
  loading ??= import('./unit-reader').then((m) => {
    reader = m.createUnitReader();
  });
  return loading;
}

/**
 * Runs `attempt` (which reads values with `parseValue`); when some value needed the unit reader
 * before it was loaded, loads it and runs `attempt` again, so the result is as if it had always
 * been there. `attempt` must not have side effects that matter when repeated.
 */
export async function withUnitReader<T>(attempt: () => T): Promise<T> {
  const before = misses;
  const first = attempt();
  if (misses === before) return first;
  await loadUnitReader();
  return attempt();
}

function mathjs(): UnitReader | null {
  if (!reader) misses++;
  return reader;
}

/** What a value is measured in: ohms, volts, amperes, watts, farads, a ratio (1 % = 0.01) or a bare number. */
export type ValueUnit = 'ohm' | 'V' | 'A' | 'W' | 'F' | 'ratio' | 'none';

/** The outcome of reading a value: the SI number, or a message naming the value and what is allowed. */
export type ParseResult =
  | { ok: true; value: number }
  /** `needsUnitReader`: the text needs the unit reader, which is not loaded yet (see `loadUnitReader`). */
  | { ok: false; message: string; needsUnitReader?: true };

/** SI prefix letters accepted in text, as powers of ten. `u` stands for µ; `K` is taken as kilo. */
const PREFIX: Record<string, number> = {
  p: -12, n: -9, u: -6, m: -3, k: 3, K: 3, M: 6, G: 9, T: 12,
};

interface UnitInfo {
  /** Words used in messages: "a value in ohms". */
  noun: string;
  /** Examples shown after "write". */
  examples: string;
  /** mathjs unit name, or null when the value carries no physical unit. */
  mathjs: string | null;
  /** RKM letters that act as the decimal point, with their power of ten. */
  rkm: Record<string, number>;
  /** Least allowed value and whether it is itself allowed. */
  min?: { value: number; inclusive: boolean; text: string };
}

/**
 * IEC 60062 RKM letters. For resistance, R marks the decimal point of ohms, K/k, M, G, T the
 * multipliers; lowercase m and L are read as milli (m is distinct from M, mega). Other units use
 * their symbol (2V5) or an SI prefix letter (4m7, 2u2) as the decimal marker, a common practice.
 */
const UNITS: Record<ValueUnit, UnitInfo> = {
  ohm: {
    noun: 'a value in ohms', examples: '4k7, 4.7k or 4700', mathjs: 'ohm',
    rkm: { R: 0, r: 0, L: -3, m: -3, k: 3, K: 3, M: 6, G: 9, T: 12 },
    min: { value: 0, inclusive: false, text: 'a resistance must be greater than 0 ohms' },
  },
  V: { noun: 'a voltage', examples: '2.5, 2V5, 2.5 V or 2500 mV', mathjs: 'V', rkm: { V: 0, ...prefixes('munk') } },
  A: { noun: 'a current', examples: '0.00047, 470u, 470 µA or 0.47 mA', mathjs: 'A', rkm: { A: 0, ...prefixes('pnum') } },
  W: {
    noun: 'a power', examples: '0.25, 250m or 250 mW', mathjs: 'W', rkm: { W: 0, ...prefixes('umk') },
    min: { value: 0, inclusive: true, text: 'a power must not be negative' },
  },
  F: {
    noun: 'a capacitance', examples: '100n, 100 nF or 1e-7', mathjs: 'F', rkm: prefixes('pnum'),
    min: { value: 0, inclusive: true, text: 'a capacitance must not be negative' },
  },
  ratio: { noun: 'a ratio', examples: '0.01, 1 % or 1%', mathjs: null, rkm: {} },
  none: { noun: 'a number', examples: '3, 1.5e3 or 1k5', mathjs: null, rkm: prefixes('munkM') },
};

function prefixes(letters: string): Record<string, number> {
  return Object.fromEntries([...letters].map((l) => [l, PREFIX[l]]));
}

/** Dimensions named in "is a current, not ..." messages. */
const DIMENSIONS: ReadonlyArray<[string, string]> = [
  ['ohm', 'a resistance'], ['V', 'a voltage'], ['A', 'a current'], ['W', 'a power'],
  ['F', 'a capacitance'], ['s', 'a time'], ['Hz', 'a frequency'], ['K', 'a temperature'],
  ['H', 'an inductance'], ['m', 'a length'],
];

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i;
const RKM = /^([+-]?)(\d*)([A-Za-z])(\d*)$/;
const WITH_PREFIX = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*([pnumkKMGT])$/i;

/** A decimal string times a power of ten, converted once so 4k7 is exactly 4700. */
function decimal(text: string, exponent: number): number {
  const direct = Number(`${text}e${exponent}`);
  return Number.isNaN(direct) ? clean(Number(text) * 10 ** exponent) : direct;
}

/** Drops binary noise such as 4700.000000000001 that mathjs arithmetic may leave. */
function clean(value: number): number {
  return Number(value.toPrecision(15));
}

function readPlain(text: string, unit: ValueUnit): number | null {
  if (NUMBER.test(text)) return Number(text);
  if (unit === 'ratio') {
    const pct = /^(.*?)\s*(%|ppm)$/.exec(text);
    if (pct && NUMBER.test(pct[1])) return decimal(pct[1], pct[2] === '%' ? -2 : -6);
    return null;
  }
  const rkm = RKM.exec(text);
  const letters = UNITS[unit].rkm;
  if (rkm && (rkm[2] || rkm[4]) && rkm[3] in letters) {
    const [, sign, whole, letter, frac] = rkm;
    return decimal(`${sign}${whole || '0'}.${frac || '0'}`, letters[letter]);
  }
  const pre = WITH_PREFIX.exec(text);
  if (pre && pre[2] in PREFIX) return decimal(pre[1], PREFIX[pre[2]]);
  return null;
}

/** The unit's own symbol at the end of the text ("4k7 ohm", "2.5 V", "50 mV"), dropped before reading. */
const SYMBOL: Partial<Record<ValueUnit, RegExp>> = {
  ohm: /\s*ohms?$/i, V: /\s*V$/, A: /\s*A$/, W: /\s*W$/, F: /\s*F$/,
};

function readOwn(text: string, unit: ValueUnit): number | null {
  const plain = readPlain(text, unit);
  if (plain !== null) return plain;
  const symbol = SYMBOL[unit];
  if (!symbol || !symbol.test(text)) return null;
  const rest = text.replace(symbol, '');
  return /\d/.test(rest) ? readPlain(rest, unit) : null;
}

function fail(input: string, unit: ValueUnit, why?: string): { ok: false; message: string } {
  const info = UNITS[unit];
  const head = why ? `"${input}" ${why}` : `"${input}" is not ${info.noun}`;
  return { ok: false, message: `${head}: write ${info.examples}` };
}

function readWithUnit(text: string, input: string, unit: ValueUnit): ParseResult {
  const info = UNITS[unit];
  const math = mathjs();
  if (!math) return { ...fail(input, unit, 'needs the unit reader, which is not loaded yet'), needsUnitReader: true };
  let parsed: ReturnType<UnitReader['unit']>;
  try {
    parsed = math.unit(text);
  } catch {
    return fail(input, unit);
  }
  if (parsed.value === null) return fail(input, unit, `has no number`);
  if (info.mathjs && parsed.equalBase(math.unit(info.mathjs))) {
    return { ok: true, value: clean(parsed.toNumber(info.mathjs)) };
  }
  const found = DIMENSIONS.find(([name]) => parsed.equalBase(math.unit(name)));
  return fail(input, unit, found ? `is ${found[1]}, not ${info.noun}` : `has the wrong unit for ${info.noun}`);
}

/**
 * Reads a value given as a number (already SI) or text. Accepted text: plain numbers ("4700",
 * "4.7e3"), IEC 60062 RKM codes ("4k7", "2R2", "R47", "1M0"; lowercase m and L are milliohm, so
 * "4m7" is 4.7 mΩ), an SI prefix ("4.7k", "470u"), a number with a unit ("4.7 kΩ", "4.7kohm",
 * "470 µA", "50 mV"), and for ratios a percentage ("1 %", "0.5%") or ppm. `unit` names what the
 * value must be; text in another unit is refused with a message saying what was expected.
 * Resistances must be > 0; powers and capacitances ≥ 0; voltages and currents may be negative.
 * Unit names beyond the unit's own symbol ("3 volts") and the "is a current, not ..." messages come
 * from the unit reader: read such text through `withUnitReader`, or after `loadUnitReader`.
 */
export function parseValue(input: string | number, unit: ValueUnit): ParseResult {
  const shown = String(input);
  let value: number;
  if (typeof input === 'number') {
    value = input;
  } else {
    const text = input.trim().replace(/[µμ]/g, 'u').replace(/[ΩΩ]/g, 'ohm');
    if (text === '') return { ok: false, message: `"" is empty: write ${UNITS[unit].examples}` };
    const own = readOwn(text, unit);
    if (own !== null) {
      value = own;
    } else {
      if (!UNITS[unit].mathjs || !/\d/.test(text)) return fail(shown, unit);
      const read = readWithUnit(text, shown, unit);
      if (!read.ok) return read;
      value = read.value;
    }
  }
  if (!Number.isFinite(value)) return fail(shown, unit, 'is not a finite number');
  const min = UNITS[unit].min;
  if (min && (value < min.value || (!min.inclusive && value === min.value))) {
    return { ok: false, message: `"${shown}" is not allowed: ${min.text}` };
  }
  return { ok: true, value: value === 0 ? 0 : value };
}
