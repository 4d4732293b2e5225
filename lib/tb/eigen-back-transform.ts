import type { HermitianScratch } from "./eigen-workspace";

/*
 * Eigenvectors of the Hermitian matrix from those of its real tridiagonal form: v = Q D z, with D the diagonal
 * phase and Q = P_{n−1}⋯P_2 the product of the stored Householder reflectors (EISPACK htribk; Wilkinson &
 * Reinsch, Handbook for Automatic Computation vol. II (1971), II/2; Golub & Van Loan, "Matrix Computations",
 * 4th ed. (2013), §5.1.6 and §8.3.1).
 * Vectors are held one per row and processed two at a time. Applying P_i = I − w wᴴ/h to a vector x is a
 * dot product wᴴx (kept in registers) and an axpy; the axpy of P_i is fused with the dot product of P_{i+1},
 * so each reflector costs one pass over the vector instead of two.
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
  if (n < 3) return;
  for (let j = 0; j < n; j += 2) {
    const a = j * n;
    // With an odd count the last vector is paired with itself: every write below stores identical values.
    const b = j + 1 < n ? a + n : a;
    let row = 2 * n;
    let ar = 0;
    let ai = 0;
    let br = 0;
    let bi = 0;
    for (let k = 0; k < 2; k++) {
      const wr = re[row + k];
      const wi = im[row + k];
      ar += wr * vecRe[a + k] + wi * vecIm[a + k];
      ai += wr * vecIm[a + k] - wi * vecRe[a + k];
      br += wr * vecRe[b + k] + wi * vecIm[b + k];
      bi += wr * vecIm[b + k] - wi * vecRe[b + k];
    }
    for (let i = 2; i < n; i++) {
      // h = 0 marks a skipped reflector, whose stored w is then zero too.
      const h = reflectorNorm[i];
      const inv = h > 0 ? 1 / h : 0;
      const tar = ar * inv;
      const tai = ai * inv;
      const tbr = br * inv;
      const tbi = bi * inv;
      // The last reflector has no successor: its "next" dot product reads itself and is discarded.
      const next = i + 1 < n ? row + n : row;
      ar = 0;
      ai = 0;
      br = 0;
      bi = 0;
      for (let k = 0; k < i; k++) {
        const wr = re[row + k];
        const wi = im[row + k];
        const xr = vecRe[a + k] - (wr * tar - wi * tai);
        const xi = vecIm[a + k] - (wr * tai + wi * tar);
        const yr = vecRe[b + k] - (wr * tbr - wi * tbi);
        const yi = vecIm[b + k] - (wr * tbi + wi * tbr);
        vecRe[a + k] = xr;
        vecIm[a + k] = xi;
        vecRe[b + k] = yr;
        vecIm[b + k] = yi;
        const ur = re[next + k];
        const ui = im[next + k];
        ar += ur * xr + ui * xi;
        ai += ur * xi - ui * xr;
        br += ur * yr + ui * yi;
        bi += ur * yi - ui * yr;
      }
      if (i + 1 === n) break;
      const ur = re[next + i];
      const ui = im[next + i];
      ar += ur * vecRe[a + i] + ui * vecIm[a + i];
      ai += ur * vecIm[a + i] - ui * vecRe[a + i];
      br += ur * vecRe[b + i] + ui * vecIm[b + i];
      bi += ur * vecIm[b + i] - ui * vecRe[b + i];
      row = next;
    }
  }
}
