/**
 * Seeded random numbers and the two spread distributions. Pure: every generator is built from an
 * explicit seed, and each Monte Carlo trial gets its own stream derived from (seed, trial index), so
 * the numbers of a trial never depend on how trials are split between threads.
 */

/** How an uncertain parameter is spread over its limits. */
export type DistributionKind = 'uniform' | 'normal';

/** A source of uniform numbers in [0, 1). */
export interface Rng {
  /** Next uniform number in [0, 1). */
  next(): number;
}

/** One step of splitmix32: mixes a 32-bit state into a well-spread 32-bit output. */
function splitmix32(state: number): number {
  let z = (state + 0x9e3779b9) | 0;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * xoshiro128** generator seeded from the two 32-bit words (seed, stream). Its four state words are
 * filled by splitmix32 so neighbouring seeds and streams give unrelated sequences. The state lives
 * in an Int32Array, so the words stay raw 32-bit integers; `reseed` starts another stream in place,
 * so a run of trials needs one generator, not one per trial.
 */
export class SeededRng implements Rng {
  private readonly s = new Int32Array(4);

  constructor(seed: number, stream = 0) {
    this.reseed(seed, stream);
  }

  /** Restarts the generator as `new SeededRng(seed, stream)` would start. */
  reseed(seed: number, stream = 0): void {
    let h = splitmix32((seed >>> 0) ^ 0x5bd1e995);
    h = splitmix32(h ^ (stream >>> 0));
    const a = splitmix32(h);
    const b = splitmix32(a);
    const c = splitmix32(b);
    const d = splitmix32(c);
    const s = this.s;
    s[0] = (a | b | c | d) === 0 ? 1 : a;
    s[1] = b;
    s[2] = c;
    s[3] = d;
  }

  next(): number {
    const s = this.s;
    const a = s[0];
    const b = s[1];
    const r = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const c = s[2] ^ a;
    const d = s[3] ^ b;
    s[0] = a ^ d;
    s[1] = b ^ c;
    s[2] = c ^ (b << 9);
    s[3] = rotl(d, 11);
    return r / 4294967296;
  }
}

/** A generator for (seed, stream); see SeededRng. */
export function createRng(seed: number, stream = 0): Rng {
  return new SeededRng(seed, stream);
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/**
 * A draw on the unit interval [-1, 1] for one parameter: `uniform` spreads evenly over it; `normal`
 * has the limit at 3 sigma (sigma = 1/3) and is truncated there, as a maker's tolerance is a hard
 * limit (parts outside it are rejected), so no draw ever leaves the worst-case box.
 */
export function drawUnit(rng: Rng, kind: DistributionKind): number {
  if (kind === 'uniform') return 2 * rng.next() - 1;
  for (;;) {
    // Box–Muller; the second variate is dropped so each draw uses a fixed, known amount of stream.
    const u1 = 1 - rng.next();
    const u2 = rng.next();
    const z = Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    if (z >= -3 && z <= 3) return z / 3;
  }
}

/**
 * Standard uncertainty of a unit draw (unitless, as a fraction of the half-width): 1/sqrt(3) for
 * uniform (JCGM 100:2008, 4.3.7) and sigma of the normal truncated at 3 sigma for normal.
 */
export function unitStandardDeviation(kind: DistributionKind): number {
  if (kind === 'uniform') return 1 / Math.sqrt(3);
  // Variance of a standard normal truncated at ±3: 1 − 2·3·φ(3)/(2Φ(3) − 1).
  const phi3 = Math.exp(-4.5) / Math.sqrt(2 * Math.PI);
  const mass = 0.9973002039367398;
  return Math.sqrt(1 - (6 * phi3) / mass) / 3;
}
