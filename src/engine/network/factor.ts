/**
 * Dense-storage factorisations that solve for two right-hand sides at once (the constant part and
 * the per-unit-x part of an affine solution).
 */

/**
 * Envelope Cholesky: factors the symmetric positive definite `a` (size×size, row-major, lower
 * triangle used and overwritten) touching only each row's envelope `first[i]..i`, where fill-in
 * cannot reach, then solves for `b0` and `b1` in place. Returns false when a pivot is not positive.
 */
export function choleskyEnvelope2(a: Float64Array, size: number, first: Int32Array, b0: Float64Array, b1: Float64Array): boolean {
  for (let i = 0; i < size; i++) {
    const ri = i * size;
    const fi = first[i];
    for (let j = fi; j < i; j++) {
      const rj = j * size;
      let s = a[ri + j];
      for (let k = fi > first[j] ? fi : first[j]; k < j; k++) s -= a[ri + k] * a[rj + k];
      a[ri + j] = s / a[rj + j];
    }
    let d = a[ri + i];
    for (let k = fi; k < i; k++) d -= a[ri + k] * a[ri + k];
    if (!(d > 0)) return false;
    a[ri + i] = Math.sqrt(d);
  }
  for (let i = 0; i < size; i++) {
    const ri = i * size;
    let s0 = b0[i];
    let s1 = b1[i];
    for (let k = first[i]; k < i; k++) {
      s0 -= a[ri + k] * b0[k];
      s1 -= a[ri + k] * b1[k];
    }
    b0[i] = s0 / a[ri + i];
    b1[i] = s1 / a[ri + i];
  }
  for (let i = size - 1; i >= 0; i--) {
    const ri = i * size;
    const x0 = b0[i] / a[ri + i];
    const x1 = b1[i] / a[ri + i];
    b0[i] = x0;
    b1[i] = x1;
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
