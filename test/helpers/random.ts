/**
 * A small seeded generator for test data (mulberry32), so failing cases reproduce from their seed.
 */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A log-uniform value between lo and hi from generator r. */
export function logUniform(r: () => number, lo: number, hi: number): number {
  return lo * Math.pow(hi / lo, r());
}
