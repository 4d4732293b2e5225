import type { HermitianScratch } from "./eigen-workspace";

/*
 * Eigenvectors of the Hermitian matrix from those of its real tridiagonal form: v = Q D z, with D the diagonal
 * phase and Q = P_{n−1}⋯P_2 the product of the stored Householder reflectors (EISPACK htribk; Wilkinson &
 * Reinsch, Handbook for Automatic Computation vol. II (1971), II/2; Golub & Van Loan, "Matrix Computations",
 * 4th ed. (2013), §5.1.6 and §8.3.1).
 * Vectors are held one per row, so each reflector costs a dot product accumulated in registers plus an axpy,
 * both along contiguous memory; two vectors share each pass over a reflector.
 */

/** Row j of (s.vectorsRe, s.vectorsIm) becomes Q D z_j, where z_j is column j of the real row-major `z`. */
export function backTransformRows(n: number, re: Float64Array, im: Float64Array, z: Float64Array, s: HermitianScratch): void {
  const { phaseRe, phaseIm, reflectorNorm, vectorsRe: vecRe, vectorsIm: vecIm } = s;
  for (let k = 0; k < n; k++) {
    const dr = phaseRe[k];
    const di = phaseIm[k];
    const rk = k * n;
    for (let j = 0; j < n; j++) {
      const x = z[rk + j];
      vecRe[j * n + k] = dr * x;
      vecIm[j * n + k] = di * x;
    }
  }
  let j = 0;
  for (; j + 1 < n; j += 2) {
    const a = j * n;
    const b = a + n;
    for (let i = 2; i < n; i++) {
      const h = reflectorNorm[i];
      if (h === 0) continue;
      const row = i * n;
      let ar = 0;
      let ai = 0;
      let br = 0;
      let bi = 0;
      for (let k = 0; k < i; k++) {
        const vr = re[row + k];
        const vi = im[row + k];
        const xr = vecRe[a + k];
        const xi = vecIm[a + k];
        const yr = vecRe[b + k];
        const yi = vecIm[b + k];
        ar += vr * xr + vi * xi;
        ai += vr * xi - vi * xr;
        br += vr * yr + vi * yi;
        bi += vr * yi - vi * yr;
      }
      const inv = 1 / h;
      ar *= inv;
      ai *= inv;
      br *= inv;
      bi *= inv;
      for (let k = 0; k < i; k++) {
        const vr = re[row + k];
        const vi = im[row + k];
        vecRe[a + k] -= vr * ar - vi * ai;
        vecIm[a + k] -= vr * ai + vi * ar;
        vecRe[b + k] -= vr * br - vi * bi;
        vecIm[b + k] -= vr * bi + vi * br;
      }
    }
  }
  if (j < n) applyReflectorsToRow(n, j * n, re, im, vecRe, vecIm, reflectorNorm);
}

function applyReflectorsToRow(
  n: number, a: number, re: Float64Array, im: Float64Array, vecRe: Float64Array, vecIm: Float64Array,
  reflectorNorm: Float64Array,
): void {
  for (let i = 2; i < n; i++) {
    const h = reflectorNorm[i];
    if (h === 0) continue;
    const row = i * n;
    let ar = 0;
    let ai = 0;
    for (let k = 0; k < i; k++) {
      const vr = re[row + k];
      const vi = im[row + k];
      ar += vr * vecRe[a + k] + vi * vecIm[a + k];
      ai += vr * vecIm[a + k] - vi * vecRe[a + k];
    }
    ar /= h;
    ai /= h;
    for (let k = 0; k < i; k++) {
      const vr = re[row + k];
      const vi = im[row + k];
      vecRe[a + k] -= vr * ar - vi * ai;
      vecIm[a + k] -= vr * ai + vi * ar;
    }
  }
}
