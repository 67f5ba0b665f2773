/** Formatting helpers for the panes: every number on screen goes through here. */
import type { Design } from '../engine/design/types';
import { formatEng, formatRkm } from '../engine/values';

/** A value of the measured quantity with its unit, four significant digits (e.g. "11.80 V"). */
export function fmtX(x: number | null | undefined, d: Design, ascii: boolean, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return ascii ? '-' : '—';
  return formatEng(x, d.quantity.unit, { digits, ascii });
}

/** A difference of x with its sign (e.g. "+7.1 mV"). */
export function fmtDx(dx: number, d: Design, ascii: boolean): string {
  const text = formatEng(dx, d.quantity.unit, { digits: 2, ascii });
  return dx > 0 ? `+${text}` : text;
}

/** A resistance as an RKM code ("2k21"). */
export function fmtOhm(ohms: number): string {
  return formatRkm(ohms, 4);
}

/** A voltage ("2.273 V"). */
export function fmtV(v: number, ascii: boolean, digits = 4): string {
  return formatEng(v, 'V', { digits, ascii });
}

/** A current ("4.50 mA"); exact zero shows as "0". */
export function fmtA(a: number, ascii: boolean): string {
  return Math.abs(a) < 1e-12 ? '0' : formatEng(a, 'A', { digits: 3, ascii });
}

/** `text` cut or padded to exactly `width` cells, cut text ending in `more`. */
export function fit(text: string, width: number, more = '…'): string {
  if (width <= 0) return '';
  const chars = [...text];
  if (chars.length <= width) return text + ' '.repeat(width - chars.length);
  return chars.slice(0, Math.max(0, width - 1)).join('') + more.slice(0, 1);
}

/** `text` right-aligned in `width` cells (cut from the left when too long). */
export function right(text: string, width: number): string {
  const chars = [...text];
  return chars.length >= width ? chars.slice(chars.length - width).join('') : ' '.repeat(width - chars.length) + text;
}
