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

/**
 * The k-th smallest value of `a` (0-based), found by partial partitioning (Hoare's selection,
 * median-of-three pivot); reorders `a`. Linear on average, unlike a full sort.
 */
function select(a: Float64Array, k: number): number {
  let l = 0;
  let m = a.length - 1;
  while (l < m) {
    const p = a[l];
    const q = a[(l + m) >> 1];
    const r = a[m];
    const x = p < q ? (q < r ? q : p < r ? r : p) : p < r ? p : q < r ? r : q;
    let i = l;
    let j = m;
    do {
      while (a[i] < x) i++;
      while (x < a[j]) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    } while (i <= j);
    if (j < k) l = i;
    if (k < i) m = j;
  }
  return a[k];
}

/** `percentileSorted` of `a` as if sorted, by selection of the two order statistics it needs; reorders `a`. */
function percentileBySelection(a: Float64Array, p: number): number {
  const n = a.length;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const below = select(a, lo);
  // After selecting rank lo every later element is >= it; the next order statistic is their minimum.
  let above = lo + 1 < n ? Infinity : below;
  for (let i = lo + 1; i < n; i++) if (a[i] < above) above = a[i];
  return below + (h - lo) * (above - below);
}

/** Most order statistics kept in a buffer by `percentileNearEnd`; beyond it, selection on a copy. */
const END_BUFFER = 64;

/**
 * `percentileSorted` of `values` as if sorted, without reordering them. A percentile near either end
 * (the ±3 sigma points) needs only the few smallest or largest values: one pass keeps them in a small
 * sorted buffer, which for values in random order is about one comparison per value.
 */
function percentileNearEnd(values: Float64Array, p: number): number {
  const n = values.length;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  if (hi + 1 <= END_BUFFER) {
    // The hi + 1 smallest values, ascending: ranks 0..hi.
    const buf = smallest(values, hi + 1, 1);
    return buf[lo] + (h - lo) * (buf[hi] - buf[lo]);
  }
  if (n - lo <= END_BUFFER) {
    // The n − lo largest values, descending: index i holds rank n − 1 − i.
    const buf = smallest(values, n - lo, -1);
    const below = buf[n - 1 - lo];
    const above = buf[n - 1 - hi];
    return below + (h - lo) * (above - below);
  }
  return percentileBySelection(values.slice(), p);
}

/** The `m` smallest values (sign 1, ascending) or largest (sign −1, descending) of `values`. */
function smallest(values: Float64Array, m: number, sign: 1 | -1): Float64Array {
  const buf = new Float64Array(m);
  let count = 0;
  for (let i = 0; i < values.length; i++) {
    const v = sign * values[i];
    if (count === m && !(v < buf[m - 1])) continue;
    let j = count < m ? count++ : m - 1;
    while (j > 0 && buf[j - 1] > v) {
      buf[j] = buf[j - 1];
      j--;
    }
    buf[j] = v;
  }
  if (sign < 0) for (let i = 0; i < m; i++) buf[i] = -buf[i];
  return buf;
}

/** Statistics of `values` (any order, left as they are); null for an empty sample. */
export function sampleStats(values: Float64Array): SampleStats | null {
  const n = values.length;
  if (n === 0) return null;
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    sum += v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  return {
    count: n,
    min,
    max,
    mean,
    std: n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
    p00135: percentileNearEnd(values, 0.00135),
    p99865: percentileNearEnd(values, 0.99865),
  };
}

/** Histogram of `values` with `bins` equal bins spanning their min..max. */
export function histogram(values: Float64Array, bins: number): Histogram {
  const n = values.length;
  if (n === 0) return { from: 0, to: 0, counts: [] };
  let from = Infinity;
  let to = -Infinity;
  for (let i = 0; i < n; i++) {
    from = Math.min(from, values[i]);
    to = Math.max(to, values[i]);
  }
  const count = to > from ? Math.max(1, Math.floor(bins)) : 1;
  const counts = new Array<number>(count).fill(0);
  const width = (to - from) / count;
  for (let i = 0; i < n; i++) counts[width > 0 ? Math.min(count - 1, Math.floor((values[i] - from) / width)) : 0]++;
  return { from, to, counts };
}
