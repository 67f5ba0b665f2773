/**
 * Straight-line LDLᵀ for one envelope shape. `ldltEnvelope2` spends most of its time on loop
 * control: on a string with pendant outputs most inner loops run zero to two times. For a shape that
 * is factored many times (every trial of a spread run) the same operations, in the same order, are
 * written out as code with every index a constant, which runs about two and a half times faster and
 * gives bit-identical results. Only indices go into the code, never values or names.
 */
import type { Envelope } from './factor';

/** Factors the envelope-stored `a` and solves for `b0`, `b1` in place, as `ldltEnvelope2` does. */
export type EnvelopeKernel = (a: Float64Array, b0: Float64Array, b1: Float64Array) => boolean;

/** Most inner-loop steps a kernel is written for; a larger shape keeps the loops (its code would be huge). */
export const KERNEL_STEP_LIMIT = 6000;

/** Kernels by shape, shared by every solver (a new solver of a known shape starts with warm code). */
const kernels = new Map<string, EnvelopeKernel | null>();
const KERNEL_CACHE_LIMIT = 64;

/** The kernel for `env`'s shape, or null when the shape is too large to write out. */
export function kernelFor(env: Envelope): EnvelopeKernel | null {
  const key = env.first.join(',');
  let kernel = kernels.get(key);
  if (kernel === undefined) {
    if (kernels.size >= KERNEL_CACHE_LIMIT) kernels.clear();
    kernel = steps(env) <= KERNEL_STEP_LIMIT ? writeKernel(env) : null;
    kernels.set(key, kernel);
  }
  return kernel;
}

/** Inner-loop steps of one factor-and-solve of `env`'s shape. */
function steps(env: Envelope): number {
  const { first } = env;
  let count = 0;
  for (let i = 0; i < first.length; i++) {
    for (let j = first[i]; j < i; j++) count += 2 + Math.max(0, j - Math.max(first[i], first[j]));
    count += 3 * (i - first[i]) + 2;
  }
  return count;
}

/** Writes out `ldltEnvelope2` for `env`'s shape: the same statements in the same order. */
function writeKernel(env: Envelope): EnvelopeKernel {
  const { first, base } = env;
  const n = first.length;
  const code: string[] = ['let d, w, l;'];
  for (let i = 0; i < n; i++) {
    const ri = base[i];
    const fi = first[i];
    for (let j = fi; j < i; j++) {
      const rj = base[j];
      let terms = '';
      for (let k = Math.max(fi, first[j]); k < j; k++) terms += ` - a[${ri + k}] * a[${rj + k}]`;
      if (terms) code.push(`a[${ri + j}] = a[${ri + j}]${terms};`);
    }
    code.push(`d = a[${ri + i}];`);
    for (let j = fi; j < i; j++) code.push(`w = a[${ri + j}]; l = w * a[${base[j] + j}]; a[${ri + j}] = l; d -= w * l;`);
    code.push(`if (!(d > 0)) return false;`, `a[${ri + i}] = 1 / d;`);
  }
  for (let i = 0; i < n; i++) {
    let t0 = '';
    let t1 = '';
    for (let k = first[i]; k < i; k++) {
      t0 += ` - a[${base[i] + k}] * b0[${k}]`;
      t1 += ` - a[${base[i] + k}] * b1[${k}]`;
    }
    if (t0) code.push(`b0[${i}] = b0[${i}]${t0};`, `b1[${i}] = b1[${i}]${t1};`);
  }
  for (let i = 0; i < n; i++) code.push(`b0[${i}] *= a[${base[i] + i}];`, `b1[${i}] *= a[${base[i] + i}];`);
  for (let i = n - 1; i >= 0; i--) {
    for (let k = first[i]; k < i; k++) code.push(`b0[${k}] -= a[${base[i] + k}] * b0[${i}];`, `b1[${k}] -= a[${base[i] + k}] * b1[${i}];`);
  }
  code.push('return true;');
  return new Function('a', 'b0', 'b1', code.join('\n')) as EnvelopeKernel;
}
