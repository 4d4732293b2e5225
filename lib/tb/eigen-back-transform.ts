import type { HermitianScratch } from "./eigen-workspace";

/*
 * Eigenvectors of the Hermitian matrix from those of its real tridiagonal form: v = Q D z, with D the diagonal
 * phase and Q the product of the stored Householder reflectors (EISPACK htribk; Wilkinson & Reinsch,
 * Handbook for Automatic Computation vol. II (1971), II/2; Golub & Van Loan, "Matrix Computations",
 * 4th ed. (2013), §5.1.6 and §8.3.1). Each reflector is applied to all columns at once so that the inner
 * loops run along contiguous rows.
 */

/**
 * vec ← Q D vec, where on entry row k of the row-major n×n (vecRe, vecIm) holds component k of every
 * tridiagonal eigenvector (real, vecIm ignored) and Q = P_{n−1}⋯P_2 is stored in the lower triangle of (re, im).
 */
export function backTransformVectors(
  n: number, re: Float64Array, im: Float64Array, vecRe: Float64Array, vecIm: Float64Array, s: HermitianScratch,
): void {
  const { phaseRe, phaseIm, reflectorNorm } = s;
  for (let k = 0; k < n; k++) {
    const dr = phaseRe[k];
    const di = phaseIm[k];
    const rk = k * n;
    for (let j = 0; j < n; j++) {
      const z = vecRe[rk + j];
      vecRe[rk + j] = dr * z;
      vecIm[rk + j] = di * z;
    }
  }
  const sRe = s.tmpRe;
  const sIm = s.tmpIm;
  for (let i = 2; i < n; i++) {
    const h = reflectorNorm[i];
    if (h === 0) continue;
    const row = i * n;
    sRe.fill(0);
    sIm.fill(0);
    for (let k = 0; k < i; k++) {
      const wr = re[row + k];
      const wi = im[row + k];
      const rk = k * n;
      for (let j = 0; j < n; j++) {
        const yr = vecRe[rk + j];
        const yi = vecIm[rk + j];
        sRe[j] += wr * yr + wi * yi;
        sIm[j] += wr * yi - wi * yr;
      }
    }
    const invH = 1 / h;
    for (let k = 0; k < i; k++) {
      const wr = re[row + k] * invH;
      const wi = im[row + k] * invH;
      const rk = k * n;
      for (let j = 0; j < n; j++) {
        const tr = sRe[j];
        const ti = sIm[j];
        vecRe[rk + j] -= wr * tr - wi * ti;
        vecIm[rk + j] -= wr * ti + wi * tr;
      }
    }
  }
}
