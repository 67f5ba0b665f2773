/** Shared fixtures for design-file tests. */
import demo from '../../presets/lead-acid-12v-gauge.tapline.json';

/** A fresh deep copy of the demo design file, safe to mutate in a test. */
export function demoCopy(): any {
  return structuredClone(demo);
}

/**
 * A small seeded pseudo-random generator (32-bit linear congruential, constants from Numerical
 * Recipes, 2nd ed., §7.1) returning numbers in [0, 1), so fuzz tests repeat exactly.
 */
export function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}
