import { eigenvaluesOfNormalised, normalise } from "./eigen-tridiagonal-ql";
import type { HermitianScratch } from "./eigen-workspace";

/*
 * Eigenvectors of a real symmetric tridiagonal matrix by inverse iteration on its eigenvalues, block by
 * unreduced block, following LAPACK dstein (its constants and stopping rule from memory); Dhillon, "Current
 * inverse iteration software can fail", BIT 38 (1998) 685, reviews the method and its limits; Golub &
 * Van Loan, "Matrix Computations", 4th ed. (2013), §8.2.2. Each eigenvalue from the root-free QL is used as
 * shift in a tridiagonal LU with partial pivoting; solves from a fixed pseudo-random start run until the
 * iterate has grown enough to certify a residual of O(size·ε‖T‖), plus one more (dstein does two more;
 * one already leaves the contamination by other eigenvectors far below rounding level). Vectors whose
 * eigenvalues lie within 10⁻³‖T‖ of each other (dstein's threshold) are re-orthogonalised by modified
 * Gram–Schmidt. O(n²) work instead of the O(n³) of QL with accumulated rotations.
 * Returns false, leaving diag/off untouched, if a vector does not converge; the caller then uses QL.
 */

const EPS = Number.EPSILON;
const MAX_SOLVES = 5;
const EXTRA_SOLVES = 1;
const CLUSTER = 1e-3;

/**
 * On success: diag[j] holds the j-th eigenvalue (ascending within each unreduced block) and column j of the
 * row-major n×n `z` its unit eigenvector. Scratch: s.tmpRe, s.tmpIm, s.tmp2Re, s.tmp2Im, s.solver.
 */
export function tridiagonalEigenvectorsByInverseIteration(
  n: number, diag: Float64Array, off: Float64Array, z: Float64Array, s: HermitianScratch,
): boolean {
  const d = s.tmp2Re;
  const e = s.tmp2Im;
  const lambda = s.tmpRe;
  d.set(diag);
  e.set(off);
  const scale = normalise(n, d, e);
  lambda.set(d);
  s.tmpIm.set(e);
  z.fill(0);
  let lo = 0;
  while (lo < n) {
    let hi = lo;
    while (hi < n - 1 && Math.abs(e[hi]) > EPS * (Math.abs(d[hi]) + Math.abs(d[hi + 1]))) hi++;
    if (hi === lo) {
      z[lo * n + lo] = 1;
    } else {
      eigenvaluesOfNormalised(lambda, s.tmpIm, lo, hi + 1);
      sortRange(lambda, lo, hi + 1);
      if (!solveBlock(n, lo, hi, d, e, lambda, z, s)) return false;
    }
    lo = hi + 1;
  }
  const inv = 1 / scale;
  for (let j = 0; j < n; j++) diag[j] = lambda[j] * inv;
  return true;
}

function solveBlock(
  n: number, lo: number, hi: number, d: Float64Array, e: Float64Array, lambda: Float64Array, z: Float64Array,
  s: HermitianScratch,
): boolean {
  const { u0, u1, u2, mult, swap, x } = s.solver;
  const size = hi - lo + 1;
  let norm1 = 0;
  for (let k = lo; k <= hi; k++) {
    const col = Math.abs(d[k]) + (k > lo ? Math.abs(e[k - 1]) : 0) + (k < hi ? Math.abs(e[k]) : 0);
    if (col > norm1) norm1 = col;
  }
  const clusterGap = CLUSTER * norm1;
  const minStep = 10 * EPS * norm1;
  const tiny = EPS * norm1;
  const target = Math.sqrt(0.1 / size);
  let seed = 0x9e3779b9;
  let clusterStart = lo;
  let previousShift = -Infinity;
  for (let j = lo; j <= hi; j++) {
    let shift = lambda[j];
    if (j > lo && shift - lambda[j - 1] > clusterGap) clusterStart = j;
    if (shift - previousShift < minStep) shift = previousShift + minStep;
    previousShift = shift;
    factor(lo, hi, d, e, shift, tiny, u0, u1, u2, mult, swap);
    for (let k = lo; k <= hi; k++) {
      seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0;
      x[k] = seed / 2147483648 - 1;
    }
    let converged = 0;
    for (let solve = 0; ; solve++) {
      if (solve === MAX_SOLVES) return false;
      // Right-hand side scaled as in dstein, so that reaching `target` means a residual of O(size·ε‖T‖).
      let top = 0;
      for (let k = lo; k <= hi; k++) top = Math.max(top, Math.abs(x[k]));
      const rhs = (size * norm1 * Math.max(EPS, 1 / Math.abs(u0[hi]))) / top;
      for (let k = lo; k <= hi; k++) x[k] *= rhs;
      substitute(lo, hi, u0, u1, u2, mult, swap, x);
      for (let i = clusterStart; i < j; i++) {
        let dot = 0;
        for (let k = lo; k <= hi; k++) dot += x[k] * z[k * n + i];
        for (let k = lo; k <= hi; k++) x[k] -= dot * z[k * n + i];
      }
      let big = 0;
      for (let k = lo; k <= hi; k++) big = Math.max(big, Math.abs(x[k]));
      if (!Number.isFinite(big) || big === 0) return false;
      if (big >= target) converged++;
      if (converged > EXTRA_SOLVES) break;
    }
    let norm2 = 0;
    for (let k = lo; k <= hi; k++) norm2 += x[k] * x[k];
    const inv = 1 / Math.sqrt(norm2);
    for (let k = lo; k <= hi; k++) z[k * n + j] = x[k] * inv;
  }
  return true;
}

/**
 * (T − σI)[lo..hi] = P L U with partial pivoting (U has two super-diagonals); tiny pivots are lifted to ±tiny.
 * u0 receives the reciprocals of the pivots, so that the repeated solves need no division.
 */
function factor(
  lo: number, hi: number, d: Float64Array, e: Float64Array, shift: number, tiny: number,
  u0: Float64Array, u1: Float64Array, u2: Float64Array, mult: Float64Array, swap: Float64Array,
): void {
  let a = d[lo] - shift;
  let b = lo < hi ? e[lo] : 0;
  for (let k = lo; k < hi; k++) {
    const c = e[k];
    const nextA = d[k + 1] - shift;
    const nextB = k + 1 < hi ? e[k + 1] : 0;
    if (Math.abs(a) >= Math.abs(c)) {
      const m = a === 0 ? 0 : c / a;
      u0[k] = a;
      u1[k] = b;
      u2[k] = 0;
      mult[k] = m;
      swap[k] = 0;
      a = nextA - m * b;
      b = nextB;
    } else {
      const m = a / c;
      u0[k] = c;
      u1[k] = nextA;
      u2[k] = nextB;
      mult[k] = m;
      swap[k] = 1;
      a = b - m * nextA;
      b = -m * nextB;
    }
    if (Math.abs(u0[k]) < tiny) u0[k] = u0[k] < 0 ? -tiny : tiny;
    u0[k] = 1 / u0[k];
  }
  u0[hi] = 1 / (Math.abs(a) < tiny ? (a < 0 ? -tiny : tiny) : a);
}

/**
 * x ← (P L U)⁻¹ x on rows lo..hi (u0 holds reciprocal pivots). The row interchange is applied as an exact
 * 0/1 blend rather than a branch, because the pivoting pattern is data-dependent and mispredicts.
 */
function substitute(
  lo: number, hi: number, u0: Float64Array, u1: Float64Array, u2: Float64Array, mult: Float64Array,
  swap: Float64Array, x: Float64Array,
): void {
  let carry = x[lo];
  for (let k = lo; k < hi; k++) {
    const p = swap[k];
    const q = 1 - p;
    const next = x[k + 1];
    const top = q * carry + p * next;
    x[k] = top;
    carry = p * carry + q * next - mult[k] * top;
  }
  let after = carry * u0[hi];
  x[hi] = after;
  if (hi === lo) return;
  let current = (x[hi - 1] - u1[hi - 1] * after) * u0[hi - 1];
  x[hi - 1] = current;
  for (let k = hi - 2; k >= lo; k--) {
    const value = (x[k] - u2[k] * after - u1[k] * current) * u0[k];
    x[k] = value;
    after = current;
    current = value;
  }
}

function sortRange(a: Float64Array, from: number, to: number): void {
  for (let i = from + 1; i < to; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= from && a[j] > v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}
