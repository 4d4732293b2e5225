import { backTransformRows } from "./eigen-back-transform";
import { reduceHermitianToTridiagonal } from "./eigen-householder";
import { tridiagonalEigenvectorsByInverseIteration } from "./eigen-inverse-iteration";
import { tridiagonalEigenvalues } from "./eigen-tridiagonal-ql";
import { tridiagonalEigenvectors } from "./eigen-tridiagonal-vectors";
import { assertSize, scratchFor, type EigenWorkspace, type HermitianScratch } from "./eigen-workspace";

/*
 * Dense Hermitian eigen-solver: Householder reduction to a real tridiagonal matrix (eigen-householder.ts),
 * implicit QL with Wilkinson shifts for the eigenvalues (eigen-tridiagonal-ql.ts), tridiagonal eigenvectors
 * by QL with rotations (eigen-tridiagonal-vectors.ts) or inverse iteration (eigen-inverse-iteration.ts),
 * back-transformation of the vectors (eigen-back-transform.ts).
 * Sources: Golub & Van Loan, "Matrix Computations", 4th ed. (2013), §8.3; Wilkinson & Reinsch, Handbook for
 * Automatic Computation vol. II (1971), tred2/tql2 and the EISPACK complex variants htridi/htribk.
 */

/** Order from which inverse iteration (O(n²)) beats QL with accumulated rotations (O(n³)) on this engine;
 *  measured on random Hermitian matrices. QL also takes over if inverse iteration fails to converge. */
const INVERSE_ITERATION_FROM = 16;

export { createEigenWorkspace, type EigenWorkspace } from "./eigen-workspace";

/** H is the full n×n Hermitian matrix, row-major, H[i*n+j] = re[i*n+j] + i·im[i*n+j]. re/im MAY be overwritten.
 *  Writes the n eigenvalues, ascending, into `values`. No allocation when a workspace of size n is passed. */
export function eigvalsHermitian(
  n: number, re: Float64Array, im: Float64Array, values: Float64Array, ws?: EigenWorkspace,
): void {
  checkInput(n, re, im, values);
  const s = scratchFor(n, ws);
  reduceHermitianToTridiagonal(n, re, im, s);
  tridiagonalEigenvalues(n, s.diag, s.off);
  const d = s.diag;
  for (let i = 1; i < n; i++) {
    const x = d[i];
    let j = i - 1;
    while (j >= 0 && d[j] > x) {
      d[j + 1] = d[j];
      j--;
    }
    d[j + 1] = x;
  }
  values.set(d);
}

/** Same, plus orthonormal eigenvectors: column j of the row-major n×n (vecRe, vecIm) is the eigenvector of values[j]. */
export function eigHermitian(
  n: number, re: Float64Array, im: Float64Array, values: Float64Array,
  vecRe: Float64Array, vecIm: Float64Array, ws?: EigenWorkspace,
): void {
  checkInput(n, re, im, values);
  checkLength("vecRe", vecRe, n * n);
  checkLength("vecIm", vecIm, n * n);
  const s = scratchFor(n, ws);
  reduceHermitianToTridiagonal(n, re, im, s);
  const { diag, order } = s;
  if (n < INVERSE_ITERATION_FROM || !tridiagonalEigenvectorsByInverseIteration(n, diag, s.off, vecRe, s)) {
    vecRe.fill(0);
    for (let i = 0; i < n; i++) vecRe[i * n + i] = 1;
    tridiagonalEigenvectors(n, diag, s.off, vecRe, s);
  }
  backTransformRows(n, re, im, vecRe, s);
  sortOrder(n, s);
  const { vectorsRe, vectorsIm } = s;
  for (let j = 0; j < n; j++) {
    const src = order[j] * n;
    values[j] = diag[order[j]];
    for (let k = 0; k < n; k++) {
      vecRe[k * n + j] = vectorsRe[src + k];
      vecIm[k * n + j] = vectorsIm[src + k];
    }
  }
}

/** Stable insertion sort of indices by eigenvalue (n is small: the cost is far below the O(n³) reduction). */
function sortOrder(n: number, s: HermitianScratch): void {
  const { diag, order } = s;
  for (let i = 0; i < n; i++) {
    const x = diag[i];
    let j = i - 1;
    while (j >= 0 && diag[order[j]] > x) {
      order[j + 1] = order[j];
      j--;
    }
    order[j + 1] = i;
  }
}

function checkInput(n: number, re: Float64Array, im: Float64Array, values: Float64Array): void {
  assertSize(n);
  checkLength("re", re, n * n);
  checkLength("im", im, n * n);
  checkLength("values", values, n);
  // x·0 is 0 for finite x and NaN for ±∞ or NaN, so one comparison per row checks the lower triangle.
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let sum = 0;
    for (let k = 0; k <= i; k++) sum += re[row + k] * 0 + im[row + k] * 0;
    if (sum !== 0) throw new Error(`eigen: matrix row ${i} holds a non-finite entry`);
  }
}

function checkLength(name: string, a: Float64Array, expected: number): void {
  if (a.length !== expected) throw new Error(`eigen: ${name} has length ${a.length}, expected ${expected}`);
}
