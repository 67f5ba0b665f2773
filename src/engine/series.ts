/**
 * IEC 60063 preferred-number series (E3..E192) and stepping along them. Values are ohms (or any
 * other unit the caller chooses); a series value is `mantissa · 10^decade` with the mantissa taken
 * from the tables below and built through a decimal string, so 4.7 kΩ is exactly 4700.
 */
import type { SeriesName } from './design/types.js';

const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
] as const;

const E192 = [
  1.00, 1.01, 1.02, 1.04, 1.05, 1.06, 1.07, 1.09, 1.10, 1.11, 1.13, 1.14,
  1.15, 1.17, 1.18, 1.20, 1.21, 1.23, 1.24, 1.26, 1.27, 1.29, 1.30, 1.32,
  1.33, 1.35, 1.37, 1.38, 1.40, 1.42, 1.43, 1.45, 1.47, 1.49, 1.50, 1.52,
  1.54, 1.56, 1.58, 1.60, 1.62, 1.64, 1.65, 1.67, 1.69, 1.72, 1.74, 1.76,
  1.78, 1.80, 1.82, 1.84, 1.87, 1.89, 1.91, 1.93, 1.96, 1.98, 2.00, 2.03,
  2.05, 2.08, 2.10, 2.13, 2.15, 2.18, 2.21, 2.23, 2.26, 2.29, 2.32, 2.34,
  2.37, 2.40, 2.43, 2.46, 2.49, 2.52, 2.55, 2.58, 2.61, 2.64, 2.67, 2.71,
  2.74, 2.77, 2.80, 2.84, 2.87, 2.91, 2.94, 2.98, 3.01, 3.05, 3.09, 3.12,
  3.16, 3.20, 3.24, 3.28, 3.32, 3.36, 3.40, 3.44, 3.48, 3.52, 3.57, 3.61,
  3.65, 3.70, 3.74, 3.79, 3.83, 3.88, 3.92, 3.97, 4.02, 4.07, 4.12, 4.17,
  4.22, 4.27, 4.32, 4.37, 4.42, 4.48, 4.53, 4.59, 4.64, 4.70, 4.75, 4.81,
  4.87, 4.93, 4.99, 5.05, 5.11, 5.17, 5.23, 5.30, 5.36, 5.42, 5.49, 5.56,
  5.62, 5.69, 5.76, 5.83, 5.90, 5.97, 6.04, 6.12, 6.19, 6.26, 6.34, 6.42,
  6.49, 6.57, 6.65, 6.73, 6.81, 6.90, 6.98, 7.06, 7.15, 7.23, 7.32, 7.41,
  7.50, 7.59, 7.68, 7.77, 7.87, 7.96, 8.06, 8.16, 8.25, 8.35, 8.45, 8.56,
  8.66, 8.76, 8.87, 8.98, 9.09, 9.20, 9.31, 9.42, 9.53, 9.65, 9.76, 9.88,
] as const;

const E96 = [
  1.00, 1.02, 1.05, 1.07, 1.10, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.30,
  1.33, 1.37, 1.40, 1.43, 1.47, 1.50, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74,
  1.78, 1.82, 1.87, 1.91, 1.96, 2.00, 2.05, 2.10, 2.15, 2.21, 2.26, 2.32,
  2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.80, 2.87, 2.94, 3.01, 3.09,
  3.16, 3.24, 3.32, 3.40, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12,
  4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49,
  5.62, 5.76, 5.90, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32,
  7.50, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
] as const;

const E48 = [
  1.00, 1.05, 1.10, 1.15, 1.21, 1.27, 1.33, 1.40, 1.47, 1.54, 1.62, 1.69,
  1.78, 1.87, 1.96, 2.05, 2.15, 2.26, 2.37, 2.49, 2.61, 2.74, 2.87, 3.01,
  3.16, 3.32, 3.48, 3.65, 3.83, 4.02, 4.22, 4.42, 4.64, 4.87, 5.11, 5.36,
  5.62, 5.90, 6.19, 6.49, 6.81, 7.15, 7.50, 7.87, 8.25, 8.66, 9.09, 9.53,
] as const;

/**
 * The IEC 60063 tables as mantissas in [1, 10), ascending. Written out in full: E24 and the
 * coarser series keep their historic values (2.7, 3.3, 4.7, 8.2, ...) that a rounding formula
 * would not give, and E192 has 9.20 where the formula gives 9.19.
 */
export const SERIES: Record<SeriesName, readonly number[]> = {
  E3: [1.0, 2.2, 4.7],
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24,
  E48,
  E96,
  E192,
};

/** Relative distance under which a number counts as equal to a series value (floating-point slack). */
const SAME = 1e-9;

/** The k-th value of a series counted over all decades (k = 0 is 1, k = n is 10, k = -1 is the top of 0.1..1). */
function valueAt(series: SeriesName, k: number): number {
  const table = SERIES[series];
  const decade = Math.floor(k / table.length);
  return Number(`${table[k - decade * table.length]}e${decade}`);
}

function checkPositive(value: number, fn: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${fn}: ${value} is not a positive finite number; series values are > 0`);
  }
}

/** Where a value sits: the largest k with valueAt(k) ≤ value, and whether it equals that value. */
function locate(value: number, series: SeriesName): { k: number; exact: boolean } {
  const n = SERIES[series].length;
  let decade = Math.floor(Math.log10(value));
  if (value < Number(`1e${decade}`)) decade -= 1;
  if (value >= Number(`1e${decade + 1}`)) decade += 1;
  const top = (decade + 1) * n;
  if (Math.abs(valueAt(series, top) - value) <= SAME * value) return { k: top, exact: true };
  for (let k = top - 1; k >= decade * n - 1; k -= 1) {
    const v = valueAt(series, k);
    if (Math.abs(v - value) <= SAME * value) return { k, exact: true };
    if (v < value) return { k, exact: false };
  }
  return { k: decade * n - 1, exact: false };
}

/**
 * The series value nearest to `value` on a log scale, in any decade (same unit as `value`).
 * A value exactly halfway (the geometric mean of two neighbours) goes to the lower one.
 * Throws RangeError for values that are not positive finite numbers.
 */
export function nearestInSeries(value: number, series: SeriesName): number {
  checkPositive(value, 'nearestInSeries');
  const { k, exact } = locate(value, series);
  const lower = valueAt(series, k);
  if (exact) return lower;
  const upper = valueAt(series, k + 1);
  return value * value <= lower * upper ? lower : upper;
}

/**
 * The series value `steps` places above (steps > 0) or below (steps < 0) `value`. An off-series
 * value first steps to the series value just above or below it, so step +1 from 4.5 k in E12 is
 * 4.7 k. With steps = 0 it returns the nearest series value. Throws RangeError as nearestInSeries.
 */
export function stepInSeries(value: number, series: SeriesName, steps: number): number {
  checkPositive(value, 'stepInSeries');
  if (!Number.isInteger(steps)) throw new RangeError(`stepInSeries: steps must be an integer, got ${steps}`);
  const { k, exact } = locate(value, series);
  if (exact) return valueAt(series, k + steps);
  if (steps === 0) return nearestInSeries(value, series);
  return valueAt(series, steps > 0 ? k + steps : k + steps + 1);
}

/**
 * Candidate values around `value` for a search: the k series values strictly below it and the k
 * strictly above it, plus `value` itself when it is a series value; ascending. k is a count ≥ 0.
 * Throws RangeError as nearestInSeries.
 */
export function seriesNeighbours(value: number, series: SeriesName, k: number): number[] {
  checkPositive(value, 'seriesNeighbours');
  if (!Number.isInteger(k) || k < 0) throw new RangeError(`seriesNeighbours: k must be a whole number ≥ 0, got ${k}`);
  const { k: at, exact } = locate(value, series);
  const first = exact ? at - k : at - k + 1;
  const last = at + k;
  const out: number[] = [];
  for (let i = first; i <= last; i += 1) out.push(valueAt(series, i));
  return out;
}

/** Whether `value` is a value of the series in some decade (relative slack 1e-9). False for non-positive or non-finite input. */
export function isInSeries(value: number, series: SeriesName): boolean {
  if (!Number.isFinite(value) || value <= 0) return false;
  return locate(value, series).exact;
}

/**
 * Reads a series name such as "E24", "e96", "E 12" or "24". Returns null when the text names no
 * IEC 60063 series this tool knows (E3, E6, E12, E24, E48, E96, E192).
 */
export function parseSeriesName(text: string): SeriesName | null {
  const match = /^\s*e?\s*(\d+)\s*$/i.exec(text);
  if (!match) return null;
  const name = `E${Number(match[1])}`;
  return name in SERIES ? (name as SeriesName) : null;
}
