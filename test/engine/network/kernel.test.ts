import { lusolve } from 'mathjs';
import { describe, expect, test } from 'vitest';
import { type Envelope, envelopeOf, envelopeToDense, KERNEL_AFTER, ldltEnvelope2, solveEnvelope2 } from '../../../src/engine/network/factor';
import { kernelFor } from '../../../src/engine/network/kernel';
import { rng } from '../../helpers/random';

/** A random envelope shape of n rows (each row starts 0 to `reach` columns left of the diagonal). */
function randomShape(r: () => number, n: number, reach: number): Envelope {
  const first = Int32Array.from({ length: n }, (_, i) => Math.max(0, i - Math.floor(r() * (reach + 1))));
  return envelopeOf(first);
}

/** A symmetric, strictly diagonally dominant (so positive definite) matrix in `env`'s storage. */
function randomMatrix(r: () => number, env: Envelope): Float64Array {
  const n = env.first.length;
  const a = new Float64Array(env.size);
  const rowSum = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = env.first[i]; j < i; j++) {
      const v = -r() * 10 ** (r() * 6 - 3);
      a[env.base[i] + j] = v;
      rowSum[i] += -v;
      rowSum[j] += -v;
    }
  }
  for (let i = 0; i < n; i++) a[env.base[i] + i] = rowSum[i] + r() * 1e-3 + 1e-9;
  return a;
}

const run = (f: (a: Float64Array, b0: Float64Array, b1: Float64Array) => boolean, a: Float64Array, b0: Float64Array, b1: Float64Array) => {
  const [m, x0, x1] = [a.slice(), b0.slice(), b1.slice()];
  const ok = f(m, x0, x1);
  return { ok, m: Array.from(m), x0: Array.from(x0), x1: Array.from(x1) };
};

describe('straight-line LDLᵀ kernels', () => {
  test('a kernel gives the loop factorisation bit for bit, and both solve what mathjs lusolve solves', () => {
    const r = rng(61);
    for (let t = 0; t < 150; t++) {
      const n = 1 + Math.floor(r() * 30);
      const env = randomShape(r, n, Math.floor(r() * 6));
      const a = randomMatrix(r, env);
      const b0 = Float64Array.from({ length: n }, () => r() * 2 - 1);
      const b1 = Float64Array.from({ length: n }, () => r());
      const kernel = kernelFor(env)!;
      const loops = run((m, x0, x1) => ldltEnvelope2(m, env, x0, x1), a, b0, b1);
      expect(run(kernel, a, b0, b1)).toEqual(loops);
      // Reference: mathjs lusolve (a general-purpose library) on the full matrix.
      const dense = envelopeToDense(a, env);
      const rows = Array.from({ length: n }, (_, i) => Array.from(dense.subarray(i * n, i * n + n)));
      const want = (lusolve(rows, Array.from(b0)) as number[][]).map((row) => row[0]);
      want.forEach((w, i) => expect(loops.x0[i]).toBeCloseTo(w, 6));
    }
  });

  test('a matrix that is not positive definite fails at the same row, leaving the same numbers', () => {
    const r = rng(62);
    for (let t = 0; t < 40; t++) {
      const n = 3 + Math.floor(r() * 20);
      const env = randomShape(r, n, 3);
      const a = randomMatrix(r, env);
      const bad = Math.floor(r() * n);
      a[env.base[bad] + bad] = -1;
      const b = new Float64Array(n).fill(1);
      const loops = run((m, x0, x1) => ldltEnvelope2(m, env, x0, x1), a, b, b);
      expect(loops.ok).toBe(false);
      expect(run(kernelFor(env)!, a, b, b)).toEqual(loops);
    }
  });

  test('a shape is written out only once it is hot, and a huge one never', () => {
    const r = rng(63);
    const env = randomShape(r, 12, 2);
    const a = randomMatrix(r, env);
    const b = new Float64Array(12).fill(1);
    for (let k = 1; k < KERNEL_AFTER; k++) solveEnvelope2(a.slice(), env, b.slice(), b.slice());
    expect(env.kernel).toBeNull();
    solveEnvelope2(a.slice(), env, b.slice(), b.slice());
    expect(env.kernel).not.toBeNull();
    // A full 80×80 envelope would be tens of thousands of statements: it keeps the loops.
    expect(kernelFor(envelopeOf(new Int32Array(80)))).toBeNull();
  });
});
