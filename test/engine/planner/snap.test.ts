import { describe, expect, test } from 'vitest';
import { rng } from '../../helpers/random';
import type { SeriesName } from '../../../src/engine/design/types';
import { nearestInSeries } from '../../../src/engine/series';
import { bestPair, candidatesFor, roundEach, snapScales, snapString, stringCost, tapFractions } from '../../../src/engine/planner/snap';

/** A random string of `n` resistors, 100 Ω to 100 kΩ, log-uniform. */
function randomString(next: () => number, n: number): number[] {
  return Array.from({ length: n }, () => 10 ** (2 + 3 * next()));
}

/** Independent exhaustive search over the same space: every scale, every combination of candidates. */
function bruteForce(ideal: number[], series: SeriesName, minTotal: number): number {
  const target = tapFractions(ideal);
  let best = Infinity;
  for (const s of snapScales(series)) {
    const cands = ideal.map((v) => candidatesFor(v * s, series));
    const pick = (i: number, chosen: number[]): void => {
      if (i === cands.length) {
        if (chosen.reduce((a, b) => a + b, 0) >= minTotal) best = Math.min(best, stringCost(chosen, target));
        return;
      }
      for (const v of cands[i]) pick(i + 1, [...chosen, v]);
    };
    pick(0, []);
  }
  return best;
}

describe('joint string snapping', () => {
  test('tap fractions follow the unloaded divider formula V_tap/V_top = R_below/R_total (textbook divider)', () => {
    // 1k over 2k over 1k: taps at 3/4 and 1/4 of the top (hand arithmetic).
    expect(tapFractions([1e3, 2e3, 1e3])).toEqual([0.75, 0.25]);
  });

  test('is never worse than rounding each resistor alone (200 seeded strings of 2 to 9 resistors, E24 and E96)', () => {
    const next = rng(1);
    for (let k = 0; k < 200; k++) {
      const series: SeriesName = k % 2 ? 'E24' : 'E96';
      const ideal = randomString(next, 2 + (k % 8));
      const joint = snapString(ideal, series, 0);
      const rounded = stringCost(roundEach(ideal, series), tapFractions(ideal));
      expect(joint).not.toBeNull();
      expect(joint!.cost).toBeLessThanOrEqual(rounded + 1e-15);
    }
  });

  test('equals an exhaustive search over neighbouring values and scales on strings of up to five resistors', () => {
    const next = rng(7);
    for (let k = 0; k < 60; k++) {
      const series: SeriesName = (['E12', 'E24', 'E96'] as const)[k % 3];
      const ideal = randomString(next, 2 + (k % 4));
      const minTotal = k % 2 ? 0 : ideal.reduce((a, b) => a + b, 0);
      const joint = snapString(ideal, series, minTotal);
      const brute = bruteForce(ideal, series, minTotal);
      expect(joint!.cost).toBeCloseTo(brute, 15);
    }
  });

  test('keeps the total at or above the budget minimum', () => {
    const ideal = [4.3e3, 1.1e3, 0.9e3, 12e3];
    const minTotal = ideal.reduce((a, b) => a + b, 0);
    const snap = snapString(ideal, 'E24', minTotal)!;
    expect(snap.values.reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(minTotal);
  });
});

describe('two-resistor pairs', () => {
  test('a pair of E24 values gets closer to 5.55 kΩ than one E24 value does', () => {
    // E24 neighbours of 5.55 k are 5.1 k and 5.6 k (IEC 60063 table); 5.6 k misses by 0.9 %.
    const single = Math.abs(nearestInSeries(5550, 'E24') / 5550 - 1);
    const pair = bestPair('RS1', 5550, 'E24');
    const [a, b] = pair.values;
    // Series sum or parallel formula (textbook), recomputed here.
    const realised = pair.how === 'series' ? a + b : (a * b) / (a + b);
    expect(realised).toBeCloseTo(pair.realised, 9);
    expect(Math.abs(realised / 5550 - 1)).toBeLessThan(single);
  });
});
