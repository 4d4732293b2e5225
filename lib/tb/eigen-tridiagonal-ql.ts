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
/** Outside (SAFE_PRODUCT, SAFE_LARGE), p·t or the squares formed from it might underflow or overflow; the step
 *  then divides twice. Within it p < 2^450 (as t ≥ p) and the matrix is scaled to norm ≤ 1, so N = p(α−σ) − bb·γ
 *  (see the loop), N² and N²/(p·t) stay finite. */
const SAFE_PRODUCT = 2 ** -900;
const SAFE_LARGE = 2 ** 900;

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
      const oldGamma = gamma;
      const alpha = diag[i];
      // With r = 1/(p·t): c = p/t = p²r, s = bb/t = bb·p·r, and for N = p(α−σ) − bb·γ_old the new
      // γ = c(α−σ) − s·γ_old = N·p·r and p = γ²/c = N²·r. The loop is latency-bound, and this leaves one
      // addition, one multiplication, one division and one multiplication from p to the next p (N, c and s
      // are computed beside that chain). Outside the safe range of p·t the plain divisions are used.
      const pt = p * t;
      if (pt > SAFE_PRODUCT && pt < SAFE_LARGE) {
        const r = 1 / pt;
        const pr = p * r;
        const num = p * (alpha - sigma) - bb * oldGamma;
        c = p * pr;
        s = bb * pr;
        gamma = num * pr;
        diag[i + 1] = oldGamma + (alpha - gamma);
        p = num * num * r;
      } else {
        c = p / t;
        s = bb / t;
        gamma = c * (alpha - sigma) - s * oldGamma;
        diag[i + 1] = oldGamma + (alpha - gamma);
        p = c !== 0 ? (gamma * gamma) / c : oldC * bb;
      }
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
