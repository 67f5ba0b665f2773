/**
 * Standard values (IEC 60063). A string is a chain of ratios, so it is snapped jointly: every
 * resistor may take a series neighbour of its ideal value times a common scale, and the choice
 * that keeps every tap fraction closest to its ideal (smallest worst error) wins, found by an exact
 * branch-and-bound over those candidates. Totals below `minTotal` (the current budget) are refused.
 */
import type { SeriesName } from '../design/types';
import { nearestInSeries, SERIES, seriesNeighbours, stepInSeries } from '../series';
import type { PairOffer } from './types';

/** Scale factors tried for a string: 8 steps over two series steps, from 1 up (less current). */
export function snapScales(series: SeriesName): number[] {
  const n = SERIES[series].length;
  return Array.from({ length: 8 }, (_, j) => 10 ** ((2 * j) / (8 * n)));
}

/** Candidate series values (ohms) for one ideal value (ohms): its neighbour below and above, and itself if in the series. */
export function candidatesFor(ideal: number, series: SeriesName): number[] {
  return seriesNeighbours(ideal, series, 1);
}

/** Tap fractions of a string, top to bottom: tap j sits at (resistance below it) / (total), j = 1..n−1. */
export function tapFractions(values: readonly number[]): number[] {
  const total = values.reduce((a, b) => a + b, 0);
  const out: number[] = [];
  let below = total;
  for (let j = 0; j < values.length - 1; j++) {
    below -= values[j];
    out.push(below / total);
  }
  return out;
}

/** Worst absolute tap-fraction error of `values` against `target` fractions (dimensionless). */
export function stringCost(values: readonly number[], target: readonly number[]): number {
  const f = tapFractions(values);
  let worst = 0;
  for (let j = 0; j < f.length; j++) worst = Math.max(worst, Math.abs(f[j] - target[j]));
  return worst;
}

/** Each resistor rounded alone to its nearest series value (ohms): the baseline joint snapping must beat. */
export function roundEach(ideal: readonly number[], series: SeriesName): number[] {
  return ideal.map((v) => nearestInSeries(v, series));
}

/** Result of snapping a string. */
export interface StringSnap {
  /** Series values, top to bottom (ohms). */
  values: number[];
  /** Worst tap-fraction error (dimensionless). */
  cost: number;
  /** Scale applied to the ideal values. */
  scale: number;
}

/**
 * Joint snapping of a string (ideal values top to bottom, ohms) to `series`: exact minimum of the
 * worst tap-fraction error over every scale of `snapScales` and every combination of
 * `candidatesFor(scale·ideal)`, with total resistance ≥ `minTotal` (ohms). Null when no
 * combination meets the total.
 */
export function snapString(ideal: readonly number[], series: SeriesName, minTotal = 0): StringSnap | null {
  const target = tapFractions(ideal);
  let best: StringSnap | null = null;
  for (const scale of snapScales(series)) {
    const cands = ideal.map((v) => candidatesFor(v * scale, series));
    const found = searchScale(cands, target, minTotal, best ? best.cost : Infinity);
    if (found && (!best || found.cost < best.cost)) best = { ...found, scale };
  }
  return best;
}

function searchScale(cands: number[][], target: readonly number[], minTotal: number, bound: number): { values: number[]; cost: number } | null {
  const m = cands.length;
  // restMin[i] / restMax[i]: least and most resistance of resistors 0..i−1 (above position i).
  const restMin = new Float64Array(m + 1);
  const restMax = new Float64Array(m + 1);
  for (let i = 0; i < m; i++) {
    restMin[i + 1] = restMin[i] + Math.min(...cands[i]);
    restMax[i + 1] = restMax[i] + Math.max(...cands[i]);
  }
  const chosen = new Array<number>(m).fill(0);
  const below = new Float64Array(m + 1);
  let bestCost = bound;
  let bestValues: number[] | null = null;
  // Choose from the bottom resistor up; below[i] is the resistance of resistors i..m−1.
  const visit = (i: number): void => {
    if (i < 0) {
      const total = below[0];
      if (total < minTotal) return;
      let cost = 0;
      for (let j = 1; j < m; j++) cost = Math.max(cost, Math.abs(below[j] / total - target[j - 1]));
      if (cost < bestCost) {
        bestCost = cost;
        bestValues = chosen.slice();
      }
      return;
    }
    for (const v of cands[i]) {
      chosen[i] = v;
      below[i] = below[i + 1] + v;
      const tMin = below[i] + restMin[i];
      const tMax = below[i] + restMax[i];
      if (tMax < minTotal) continue;
      // Taps at or below position i are fixed up to the total: bound their error over [tMin, tMax].
      let lb = 0;
      for (let j = Math.max(i, 1); j < m; j++) {
        const lo = below[j] / tMax;
        const hi = below[j] / tMin;
        const t = target[j - 1];
        lb = Math.max(lb, t < lo ? lo - t : t > hi ? t - hi : 0);
      }
      if (lb >= bestCost) continue;
      visit(i - 1);
    }
  };
  visit(m - 1);
  return bestValues ? { values: bestValues, cost: bestCost } : null;
}

/**
 * The best two-resistor combination for `ideal` (ohms): series (a + b, a ≤ ideal) or parallel
 * (a ∥ b, a ≥ ideal), both from `series`, smallest relative error.
 */
export function bestPair(resistor: string, ideal: number, series: SeriesName): PairOffer {
  let best: PairOffer = { resistor, ideal, values: [nearestInSeries(ideal, series), 0], how: 'series', realised: nearestInSeries(ideal, series) };
  let bestErr = Math.abs(best.realised / ideal - 1);
  const consider = (a: number, b: number, how: 'series' | 'parallel') => {
    const realised = how === 'series' ? a + b : (a * b) / (a + b);
    const err = Math.abs(realised / ideal - 1);
    if (err < bestErr) {
      bestErr = err;
      best = { resistor, ideal, values: [a, b], how, realised };
    }
  };
  const n = SERIES[series].length;
  let a = stepInSeries(ideal / 20, series, 1);
  for (let k = 0; k < 2 * n && a < ideal; k++, a = stepInSeries(a, series, 1)) {
    const rest = ideal - a;
    if (rest > 0) consider(a, nearestInSeries(rest, series), 'series');
  }
  a = stepInSeries(ideal, series, 1);
  for (let k = 0; k < 2 * n && a < ideal * 20; k++, a = stepInSeries(a, series, 1)) {
    const rest = 1 / (1 / ideal - 1 / a);
    consider(a, nearestInSeries(rest, series), 'parallel');
  }
  return best;
}
