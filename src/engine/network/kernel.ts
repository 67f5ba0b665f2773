/**
 * Straight-line code for one wiring. A solver's per-state work (stamp the state, factor by envelope
 * LDLᵀ, solve, read the node voltages and margins) spends most of its time on loop control and
 * index lookups: on a string with pendant outputs most inner loops run zero to two times. For a
 * wiring solved many times (every trial of a spread run) the same operations, in the same order, are
 * written out with every index a constant. That runs about two and a half times faster and gives
 * bit-identical results. Only integers (indices) go into the code, never values or names.
 */
import type { Envelope } from './factor';

/** The wiring a kernel is written for: every index it uses (see `Solver`). */
export interface KernelPlan {
  env: Envelope;
  /** Unknowns: the first `nu` entries of the extended vectors. */
  nu: number;
  /** Extended-vector index of every node. */
  ix: readonly number[];
  /** Each element's branch when set (on) and, where `hasOff` is 1, when clear (off): extended-vector ends. */
  onA: readonly number[];
  onB: readonly number[];
  offA: readonly number[];
  offB: readonly number[];
  hasOff: readonly number[];
  /** Each element's margin pins (extended-vector indices). */
  mPos: readonly number[];
  mNeg: readonly number[];
}

/** The arrays a kernel works on, all owned by the solver. */
export interface KernelArrays {
  /** Working matrix (envelope storage) and the state-independent matrix it starts from. */
  work: Float64Array;
  baseA: Float64Array;
  /** Extended vectors (constant and per-unit-x parts) and the unknowns' state-independent right-hand sides. */
  ext0: Float64Array;
  ext1: Float64Array;
  baseR0: Float64Array;
  baseR1: Float64Array;
  onG: Float64Array;
  onE: Float64Array;
  offG: Float64Array;
  offE: Float64Array;
  mOff: Float64Array;
}

/**
 * Stamps `state`, factors, solves, and writes the node voltages (v0, v1) and margins (da, db), as the
 * solver's loops do. Returns false, before writing any output, when the matrix is not positive
 * definite (the caller then takes the pivoting fallback).
 */
export type SolveKernel = (state: Uint8Array, arrays: KernelArrays, v0: Float64Array, v1: Float64Array, da: Float64Array, db: Float64Array) => boolean;

/**
 * Most arithmetic steps a kernel is written with (see `steps`); a larger wiring keeps the loops, as
 * its code would be huge. The 8-channel, two-package design takes about 500.
 */
export const KERNEL_STEP_LIMIT = 20_000;

/** Kernels by wiring, shared by every solver (a new solver of a known wiring starts with warm code). */
const kernels = new Map<string, SolveKernel | null>();
const KERNEL_CACHE_LIMIT = 64;

/** The kernel for `plan`, or null when the wiring is too large to write out. */
export function kernelFor(plan: KernelPlan): SolveKernel | null {
  const key = [plan.env.first, plan.ix, plan.onA, plan.onB, plan.offA, plan.offB, plan.hasOff, plan.mPos, plan.mNeg].map((a) => a.join(',')).join(';');
  let kernel = kernels.get(key);
  if (kernel === undefined) {
    if (kernels.size >= KERNEL_CACHE_LIMIT) kernels.clear();
    kernel = steps(plan) <= KERNEL_STEP_LIMIT ? (new Function('state', 'arrays', 'v0', 'v1', 'da', 'db', writeKernel(plan).join('\n')) as SolveKernel) : null;
    kernels.set(key, kernel);
  }
  return kernel;
}

/** Multiply-adds and copies a kernel for `plan` would spell out, one per term of its code. */
function steps(plan: KernelPlan): number {
  const { first } = plan.env;
  let count = 4 * plan.nu + 4 * plan.ix.length + 4 * plan.mPos.length + 8 * plan.onA.length;
  for (let i = 0; i < first.length; i++) {
    for (let j = first[i]; j < i; j++) count += j - Math.max(first[i], first[j]) + 8;
  }
  return count;
}

/** The statements of `plan`'s kernel, mirroring `Solver.stampState`, `ldltEnvelope2` and the read-out. */
function writeKernel(plan: KernelPlan): string[] {
  const { env, nu, ix, mPos, mNeg } = plan;
  const { first, base } = env;
  const code = ['const { work: m, baseA, ext0: r0, ext1: r1, baseR0, baseR1, onG, onE, offG, offE, mOff } = arrays;', 'let g, e, d, w, l;', 'm.set(baseA);'];
  for (let i = 0; i < nu; i++) code.push(`r0[${i}] = baseR0[${i}];`, `r1[${i}] = baseR1[${i}];`);
  // Solver.stamp for a branch with ends ia, ib (held ends and ground move to the right-hand sides).
  const stamp = (ia: number, ib: number) => {
    if (ia < nu) {
      code.push(`m[${base[ia] + ia}] += g;`, `r0[${ia}] += g * e;`);
      if (ib >= nu) code.push(`r0[${ia}] += g * r0[${ib}];`, `r1[${ia}] += g * r1[${ib}];`);
      else if (ib < ia) code.push(`m[${base[ia] + ib}] -= g;`);
    }
    if (ib < nu) {
      code.push(`m[${base[ib] + ib}] += g;`, `r0[${ib}] -= g * e;`);
      if (ia >= nu) code.push(`r0[${ib}] += g * r0[${ia}];`, `r1[${ib}] += g * r1[${ia}];`);
      else if (ia < ib) code.push(`m[${base[ib] + ia}] -= g;`);
    }
  };
  for (let k = 0; k < plan.onA.length; k++) {
    code.push(`if (state[${k}]) {`, `g = onG[${k}];`, `e = onE[${k}];`);
    stamp(plan.onA[k], plan.onB[k]);
    if (plan.hasOff[k]) {
      code.push('} else {', `g = offG[${k}];`, `e = offE[${k}];`);
      stamp(plan.offA[k], plan.offB[k]);
    }
    code.push('}');
  }
  // ldltEnvelope2, statement for statement.
  for (let i = 0; i < nu; i++) {
    const ri = base[i];
    const fi = first[i];
    for (let j = fi; j < i; j++) {
      let terms = '';
      for (let k = Math.max(fi, first[j]); k < j; k++) terms += ` - m[${ri + k}] * m[${base[j] + k}]`;
      if (terms) code.push(`m[${ri + j}] = m[${ri + j}]${terms};`);
    }
    code.push(`d = m[${ri + i}];`);
    for (let j = fi; j < i; j++) code.push(`w = m[${ri + j}];`, `l = w * m[${base[j] + j}];`, `m[${ri + j}] = l;`, 'd -= w * l;');
    code.push('if (!(d > 0)) return false;', `m[${ri + i}] = 1 / d;`);
  }
  for (let i = 0; i < nu; i++) {
    let t0 = '';
    let t1 = '';
    for (let k = first[i]; k < i; k++) {
      t0 += ` - m[${base[i] + k}] * r0[${k}]`;
      t1 += ` - m[${base[i] + k}] * r1[${k}]`;
    }
    if (t0) code.push(`r0[${i}] = r0[${i}]${t0};`, `r1[${i}] = r1[${i}]${t1};`);
  }
  for (let i = 0; i < nu; i++) code.push(`r0[${i}] *= m[${base[i] + i}];`, `r1[${i}] *= m[${base[i] + i}];`);
  for (let i = nu - 1; i >= 0; i--) {
    for (let k = first[i]; k < i; k++) code.push(`r0[${k}] -= m[${base[i] + k}] * r0[${i}];`, `r1[${k}] -= m[${base[i] + k}] * r1[${i}];`);
  }
  // The read-out of Solver.factorAndSolve.
  for (let k = 0; k < ix.length; k++) code.push(`v0[${k}] = r0[${ix[k]}];`, `v1[${k}] = r1[${ix[k]}];`);
  for (let k = 0; k < mPos.length; k++) code.push(`da[${k}] = r0[${mPos[k]}] - r0[${mNeg[k]}] - mOff[${k}];`, `db[${k}] = r1[${mPos[k]}] - r1[${mNeg[k]}];`);
  code.push('return true;');
  return code;
}
