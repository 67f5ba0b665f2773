/** Small descriptive statistics over plain samples, NaN-free input. */

/** Summary of a sample (same unit as the sample). */
export interface SampleStats {
  count: number;
  min: number;
  max: number;
  mean: number;
  /** Sample standard deviation (n − 1 in the denominator); 0 for fewer than two values. */
  std: number;
  /** 0.135th and 99.865th percentiles: the ±3 sigma points of a normal distribution. */
  p00135: number;
  p99865: number;
}

/** Equal-width histogram over [from, to]; `counts[i]` covers from + i·width (last bin closed). */
export interface Histogram {
  from: number;
  to: number;
  counts: number[];
}

/**
 * Percentile `p` (0..1) of an ascending-sorted sample by linear interpolation between order
 * statistics (definition 7 of Hyndman and Fan, 1996, the default of R and NumPy).
 */
export function percentileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Statistics of `values` (any order); null for an empty sample. */
export function sampleStats(values: Float64Array): SampleStats | null {
  const n = values.length;
  if (n === 0) return null;
  const sorted = Float64Array.from(values).sort();
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i];
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  return {
    count: n,
    min: sorted[0],
    max: sorted[n - 1],
    mean,
    std: n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
    p00135: percentileSorted(sorted, 0.00135),
    p99865: percentileSorted(sorted, 0.99865),
  };
}

/** Histogram of `values` with `bins` equal bins spanning their min..max. */
export function histogram(values: Float64Array, bins: number): Histogram {
  let from = Infinity;
  let to = -Infinity;
  for (const v of values) {
    from = Math.min(from, v);
    to = Math.max(to, v);
  }
  if (values.length === 0) return { from: 0, to: 0, counts: [] };
  const count = to > from ? Math.max(1, Math.floor(bins)) : 1;
  const counts = new Array<number>(count).fill(0);
  const width = (to - from) / count;
  for (const v of values) counts[width > 0 ? Math.min(count - 1, Math.floor((v - from) / width)) : 0]++;
  return { from, to, counts };
}
