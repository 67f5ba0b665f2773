import { describe, expect, test } from 'vitest';
import { histogram, percentileSorted, sampleStats } from '../../../src/engine/spread/statistics';
import { rng } from '../../helpers/random';

/** Reference: the sample sorted in full, read with Hyndman and Fan's definition 7 (NumPy's default). */
function sortedReference(values: Float64Array) {
  const sorted = Float64Array.from(values).sort();
  return { min: sorted[0], max: sorted[sorted.length - 1], lo: percentileSorted(sorted, 0.00135), hi: percentileSorted(sorted, 0.99865) };
}

describe('sample statistics', () => {
  test('the ±3 sigma percentiles equal those of the fully sorted sample, exactly', () => {
    const r = rng(21);
    for (const n of [1, 2, 3, 17, 740, 10_000]) {
      const values = Float64Array.from({ length: n }, () => 10 + r() * r());
      const stats = sampleStats(values)!;
      const ref = sortedReference(values);
      expect([stats.min, stats.max, stats.p00135, stats.p99865]).toEqual([ref.min, ref.max, ref.lo, ref.hi]);
    }
  });

  test('large samples (percentiles far from either end) and sorted input give the sorted percentiles, exactly', () => {
    const r = rng(23);
    const big = Float64Array.from({ length: 120_000 }, () => r() - 0.5);
    const ascending = Float64Array.from({ length: 3000 }, (_, i) => i / 7);
    const descending = ascending.slice().reverse();
    for (const values of [big, ascending, descending]) {
      const stats = sampleStats(values)!;
      const ref = sortedReference(values);
      expect([stats.min, stats.max, stats.p00135, stats.p99865]).toEqual([ref.min, ref.max, ref.lo, ref.hi]);
    }
  });

  test('many equal values (a quantity with little spread) still give the sorted percentiles, exactly', () => {
    const r = rng(22);
    const values = Float64Array.from({ length: 5000 }, () => [1.5, 1.5, 1.5, 2, 1][Math.floor(r() * 5)]);
    const stats = sampleStats(values)!;
    const ref = sortedReference(values);
    expect([stats.p00135, stats.p99865]).toEqual([ref.lo, ref.hi]);
  });

  test('the sample itself is left in its order (later sums read it)', () => {
    const values = Float64Array.from([3, 1, 2]);
    sampleStats(values);
    expect([...values]).toEqual([3, 1, 2]);
  });

  test('a histogram counts every value once, the maximum in the last bin', () => {
    // Counted by hand: bins of width 1 over [0, 4].
    expect(histogram(Float64Array.from([0, 0.5, 1, 2.5, 4]), 4).counts).toEqual([2, 1, 1, 1]);
  });
});
