/**
 * Factorisations that solve for two right-hand sides at once (the constant part and the per-unit-x
 * part of an affine solution): envelope LDLᵀ, and dense pivoting LU as its fallback.
 */

/**
 * Where each row of a symmetric matrix sits in envelope (skyline) storage: row i keeps its columns
 * first[i]..i contiguously, entry (i, j) at `base[i] + j`. `size` is the number of stored entries.
 */
export interface Envelope {
  first: Int32Array;
  base: Int32Array;
  size: number;
}

/** The envelope storage plan for rows that start at `first` (see Envelope). */
export function envelopeOf(first: Int32Array): Envelope {
  const base = new Int32Array(first.length);
  let size = 0;
  for (let i = 0; i < first.length; i++) {
    base[i] = size - first[i];
    size += i - first[i] + 1;
  }
  return { first, base, size };
}

/** The full row-major n×n symmetric matrix of the envelope-stored `a` (for the pivoting fallback). */
export function envelopeToDense(a: Float64Array, env: Envelope): Float64Array {
  const n = env.first.length;
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = env.first[i]; j <= i; j++) {
      const v = a[env.base[i] + j];
      m[i * n + j] = v;
      m[j * n + i] = v;
    }
  }
  return m;
}

/**
 * Envelope LDLᵀ (square-root-free Cholesky): factors the symmetric positive definite matrix `a`,
 * held in envelope storage `env` (only the lower triangle inside each row's envelope exists;
 * fill-in cannot leave it), in place, then solves for `b0` and `b1` (their first n entries) in
 * place. The unit lower factor L replaces the strict lower triangle and 1/D the diagonal, so the
 * factorisation takes one division per row and no square root, and the solves only multiply.
 * Returns false when a pivot is not positive (the matrix is not positive definite).
 */
export function ldltEnvelope2(a: Float64Array, env: Envelope, b0: Float64Array, b1: Float64Array): boolean {
  const { first, base } = env;
  const size = first.length;
  for (let i = 0; i < size; i++) {
    const ri = base[i];
    const fi = first[i];
    // Row i of L·D first (w_j = L_ij·D_j), from the finished rows j < i.
    for (let j = fi; j < i; j++) {
      const rj = base[j];
      let s = a[ri + j];
      for (let k = fi > first[j] ? fi : first[j]; k < j; k++) s -= a[ri + k] * a[rj + k];
      a[ri + j] = s;
    }
    // Then L_ij = w_j / D_j, and D_i = A_ii − Σ w_j·L_ij.
    let d = a[ri + i];
    for (let j = fi; j < i; j++) {
      const w = a[ri + j];
      const l = w * a[base[j] + j];
      a[ri + j] = l;
      d -= w * l;
    }
    if (!(d > 0)) return false;
    a[ri + i] = 1 / d;
  }
  // L·z = b, then y = D⁻¹·z, then Lᵀ·x = y.
  for (let i = 0; i < size; i++) {
    const ri = base[i];
    let s0 = b0[i];
    let s1 = b1[i];
    for (let k = first[i]; k < i; k++) {
      s0 -= a[ri + k] * b0[k];
      s1 -= a[ri + k] * b1[k];
    }
    b0[i] = s0;
    b1[i] = s1;
  }
  for (let i = 0; i < size; i++) {
    const inv = a[base[i] + i];
    b0[i] *= inv;
    b1[i] *= inv;
  }
  for (let i = size - 1; i >= 0; i--) {
    const ri = base[i];
    const x0 = b0[i];
    const x1 = b1[i];
    for (let k = first[i]; k < i; k++) {
      b0[k] -= a[ri + k] * x0;
      b1[k] -= a[ri + k] * x1;
    }
  }
  return true;
}

/**
 * Dense LU with partial pivoting on the row-major `m` (size×size), solving for two right-hand sides
 * in place. Returns false (leaving zeros) when a pivot vanishes.
 */
export function luSolve2(m: Float64Array, size: number, b0: Float64Array, b1: Float64Array): boolean {
  for (let col = 0; col < size; col++) {
    let pivot = col;
    let best = Math.abs(m[col * size + col]);
    for (let r = col + 1; r < size; r++) {
      const v = Math.abs(m[r * size + col]);
      if (v > best) {
        best = v;
        pivot = r;
      }
    }
    if (!(best > 1e-300)) {
      b0.fill(0);
      b1.fill(0);
      return false;
    }
    if (pivot !== col) {
      for (let c = 0; c < size; c++) {
        const t = m[col * size + c];
        m[col * size + c] = m[pivot * size + c];
        m[pivot * size + c] = t;
      }
      let t = b0[col];
      b0[col] = b0[pivot];
      b0[pivot] = t;
      t = b1[col];
      b1[col] = b1[pivot];
      b1[pivot] = t;
    }
    const d = m[col * size + col];
    for (let r = col + 1; r < size; r++) {
      const f = m[r * size + col] / d;
      if (f === 0) continue;
      m[r * size + col] = 0;
      for (let c = col + 1; c < size; c++) m[r * size + c] -= f * m[col * size + c];
      b0[r] -= f * b0[col];
      b1[r] -= f * b1[col];
    }
  }
  for (let r = size - 1; r >= 0; r--) {
    let s0 = b0[r];
    let s1 = b1[r];
    for (let c = r + 1; c < size; c++) {
      s0 -= m[r * size + c] * b0[c];
      s1 -= m[r * size + c] * b1[c];
    }
    const d = m[r * size + r];
    b0[r] = s0 / d;
    b1[r] = s1 / d;
  }
  return true;
}
