/** Small dense symmetric positive-definite algebra for the fit's normal equations (n = number of fitted parameters). */

/** In-place Cholesky factor (lower, row-major n×n). Returns false when the matrix is not positive definite. */
export function choleskyFactor(n: number, a: Float64Array): boolean {
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j];
    for (let k = 0; k < j; k++) d -= a[j * n + k] * a[j * n + k];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    a[j * n + j] = l;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= a[i * n + k] * a[j * n + k];
      a[i * n + j] = s / l;
    }
  }
  return true;
}

/** Solves L·Lᵀ·x = b with the factor from choleskyFactor; b is overwritten with x. */
export function choleskySolve(n: number, l: Float64Array, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * n + k] * b[k];
    b[i] = s / l[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * b[k];
    b[i] = s / l[i * n + i];
  }
}

/** Inverse of a symmetric positive-definite matrix, or null when it is singular (to working precision). */
export function invertSpd(n: number, a: Float64Array): Float64Array | null {
  const l = Float64Array.from(a);
  if (!choleskyFactor(n, l)) return null;
  let dMax = 0;
  let dMin = Infinity;
  for (let i = 0; i < n; i++) {
    dMax = Math.max(dMax, l[i * n + i]);
    dMin = Math.min(dMin, l[i * n + i]);
  }
  if (dMin < dMax * 1e-7) return null;
  const inv = new Float64Array(n * n);
  const col = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    col.fill(0);
    col[j] = 1;
    choleskySolve(n, l, col);
    for (let i = 0; i < n; i++) inv[i * n + j] = col[i];
  }
  return inv;
}

/** JᵀJ (n×n) and Jᵀr for a row-major m×n Jacobian. */
export function normalEquations(m: number, n: number, jac: Float64Array, r: Float64Array): { jtj: Float64Array; jtr: Float64Array } {
  const jtj = new Float64Array(n * n);
  const jtr = new Float64Array(n);
  for (let row = 0; row < m; row++) {
    const o = row * n;
    for (let a = 0; a < n; a++) {
      const ja = jac[o + a];
      if (ja === 0) continue;
      jtr[a] += ja * r[row];
      for (let b = a; b < n; b++) jtj[a * n + b] += ja * jac[o + b];
    }
  }
  for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) jtj[a * n + b] = jtj[b * n + a];
  return { jtj, jtr };
}
