/*
 * Eigenvalues of a real symmetric tridiagonal matrix by implicit QL with Wilkinson shifts, in the
 * square-root-free Pal–Walker–Kahan form (Parlett, "The Symmetric Eigenvalue Problem", SIAM 1998, §8.15;
 * the same recurrence as LAPACK dsterf), plus helpers shared with the eigenvector variant.
 * diag[0..n−1] is the diagonal, off[i] couples i and i+1; both are overwritten, eigenvalues end up in diag
 * (unordered). The matrix is first scaled by a power of two to a norm near 1 so that squares neither
 * overflow nor underflow; the scaling is exact and undone at the end.
 */

const EPS = Number.EPSILON;
export const SWEEPS_PER_EIGENVALUE = 30;
/** Below this, p·t might lose accuracy to underflow; the step then divides twice. */
const SAFE_PRODUCT = 2 ** -900;

export function tridiagonalEigenvalues(n: number, diag: Float64Array, off: Float64Array): void {
  const scale = normalise(n, diag, off);
  eigenvaluesOfNormalised(diag, off, 0, n);
  unscale(n, diag, scale);
}

/** PWK QL on rows from..to−1 (a block already scaled by `normalise`; off[to−1] is ignored). */
export function eigenvaluesOfNormalised(diag: Float64Array, off: Float64Array, from: number, to: number): void {
  for (let i = from; i < to - 1; i++) off[i] *= off[i];
  const maxSweeps = SWEEPS_PER_EIGENVALUE * (to - from);
  let sweeps = 0;
  let l = from;
  while (l < to) {
    const m = findSplit(l, to, diag, off, true);
    if (m === l) {
      l++;
      continue;
    }
    if (m === l + 1) {
      solveTwoByTwo(l, diag, off[l]);
      off[l] = 0;
      l += 2;
      continue;
    }
    if (++sweeps > maxSweeps) throw notConverged(maxSweeps);
    const rte = Math.sqrt(off[l]);
    let sigma = (diag[l + 1] - diag[l]) / (2 * rte);
    const r = Math.sqrt(sigma * sigma + 1);
    sigma = diag[l] - rte / (sigma + (sigma >= 0 ? r : -r));
    let c = 1;
    let s = 0;
    let gamma = diag[m] - sigma;
    let p = gamma * gamma;
    for (let i = m - 1; i >= l; i--) {
      const bb = off[i];
      const t = p + bb;
      if (i !== m - 1) off[i + 1] = s * t;
      const oldC = c;
      // c = p/t, s = bb/t and 1/c = t/p from one division: the step is latency-bound, and divisions dominate.
      const pt = p * t;
      let invC: number;
      if (pt > SAFE_PRODUCT) {
        const r = 1 / pt;
        c = p * p * r;
        s = bb * p * r;
        invC = t * t * r;
      } else {
        c = p / t;
        s = bb / t;
        invC = 1 / c;
      }
      const oldGamma = gamma;
      const alpha = diag[i];
      gamma = c * (alpha - sigma) - s * oldGamma;
      diag[i + 1] = oldGamma + (alpha - gamma);
      p = c !== 0 ? gamma * gamma * invC : oldC * bb;
    }
    off[l] = s * p;
    diag[l] = sigma + gamma;
  }
}

/** First m ≥ l with a negligible off[m] (relative to its diagonal neighbours); n−1 if none. */
export function findSplit(l: number, n: number, diag: Float64Array, off: Float64Array, squared: boolean): number {
  let m = l;
  for (; m < n - 1; m++) {
    const t = EPS * (Math.abs(diag[m]) + Math.abs(diag[m + 1]));
    if (squared ? off[m] <= t * t : Math.abs(off[m]) <= t) break;
  }
  return m;
}

/** Closed-form eigenvalues of [[a, b], [b, c]] given b²; the smaller root via the determinant avoids cancellation. */
function solveTwoByTwo(l: number, diag: Float64Array, b2: number): void {
  const a = diag[l];
  const c = diag[l + 1];
  const sum = a + c;
  const diff = a - c;
  const root = Math.sqrt(diff * diff + 4 * b2);
  const det = a * c - b2;
  if (sum > 0) {
    const hi = 0.5 * (sum + root);
    diag[l] = hi;
    diag[l + 1] = det / hi;
  } else if (sum < 0) {
    const lo = 0.5 * (sum - root);
    diag[l] = lo;
    diag[l + 1] = det / lo;
  } else {
    diag[l] = 0.5 * root;
    diag[l + 1] = -0.5 * root;
  }
}

export function normalise(n: number, diag: Float64Array, off: Float64Array): number {
  let norm = 0;
  for (let i = 0; i < n; i++) {
    const a = Math.abs(diag[i]);
    const b = Math.abs(off[i]);
    if (a > norm) norm = a;
    if (b > norm) norm = b;
  }
  if (norm === 0) return 1;
  const exponent = Math.min(1000, Math.max(-1000, Math.ceil(Math.log2(norm))));
  const scale = 2 ** -exponent;
  for (let i = 0; i < n; i++) {
    diag[i] *= scale;
    off[i] *= scale;
  }
  return scale;
}

export function unscale(n: number, diag: Float64Array, scale: number): void {
  if (scale === 1) return;
  const inv = 1 / scale;
  for (let i = 0; i < n; i++) diag[i] *= inv;
}

export function notConverged(maxSweeps: number): Error {
  return new Error(`eigen: tridiagonal QL iteration did not converge within ${maxSweeps} sweeps`);
}
