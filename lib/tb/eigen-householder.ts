import { finishUpdateVector, updateAndMultiply, updateRows } from "./eigen-householder-kernel";
import type { HermitianScratch } from "./eigen-workspace";

/*
 * Reduction of a complex Hermitian matrix to a real symmetric tridiagonal one.
 * Method: Householder reflectors P = I − v vᴴ / h applied from the last row upwards on the lower triangle,
 * then a diagonal unitary phase D that makes the sub-diagonal real and non-negative.
 * Sources: Wilkinson & Reinsch, Handbook for Automatic Computation vol. II (1971), contributions II/2 (tred2)
 * and the complex variants htridi/htribk of EISPACK (Smith et al., Springer LNCS vol. 6, 1976);
 * Golub & Van Loan, "Matrix Computations", 4th ed. (2013), §5.1 and §8.3.1.
 * Each step's rank-2 update B − v qᴴ − q vᴴ is deferred and fused with the next step's product B v′, so the
 * shrinking lower triangle is read and written once per step instead of twice (Dongarra, Hammarling &
 * Sorensen, J. Comput. Appl. Math. 27 (1989) 215, discuss the same fusion for blocked reductions).
 */

/**
 * Overwrites the lower triangle of (re, im): row i, columns 0..i−1 receive the reflector vector v_i.
 * Leaves in `s`: diag, off (|sub-diagonal|), phaseRe/phaseIm (D) and reflectorNorm (h_i, 0 = identity).
 * Only the lower triangle and the real diagonal of the input are read.
 */
export function reduceHermitianToTridiagonal(n: number, re: Float64Array, im: Float64Array, s: HermitianScratch): void {
  const { diag, off, reflectorNorm, phaseRe, phaseIm } = s;
  if (n === 0) return;
  phaseRe[n - 1] = 1;
  phaseIm[n - 1] = 0;
  let qRe = s.tmpRe;
  let qIm = s.tmpIm;
  let pRe = s.tmp2Re;
  let pIm = s.tmp2Im;
  // Row of the reflector whose rank-2 update (with q) is still owed to the leading block; −1 when none.
  let owed = -1;
  for (let i = n - 1; i >= 1; i--) {
    const l = i - 1;
    const row = i * n;
    if (owed >= 0) updateRows(n, i, i, owed, re, im, qRe, qIm);
    let scale = 0;
    for (let k = 0; k <= l; k++) scale += Math.abs(re[row + k]) + Math.abs(im[row + k]);
    let cRe = 1;
    let cIm = 0;
    let magnitude = 0;
    if (l === 0 || scale === 0) {
      reflectorNorm[i] = 0;
      magnitude = safeHypot(re[row + l], im[row + l]);
      if (magnitude > 0) {
        cRe = re[row + l] / magnitude;
        cIm = im[row + l] / magnitude;
      }
      if (owed >= 0) updateRows(n, 0, l, owed, re, im, qRe, qIm);
      owed = -1;
    } else {
      // Reflector from the conjugated row u = conj(A[i][0..l]) / scale: v = u + e^{iφ}‖u‖ e_l, h = ‖u‖² + ‖u‖|u_l|.
      const inv = 1 / scale;
      let sigma2 = 0;
      for (let k = 0; k <= l; k++) {
        const ur = re[row + k] * inv;
        const ui = -im[row + k] * inv;
        re[row + k] = ur;
        im[row + k] = ui;
        sigma2 += ur * ur + ui * ui;
      }
      const g = Math.sqrt(sigma2);
      const lr = re[row + l];
      const li = im[row + l];
      const f = Math.sqrt(lr * lr + li * li);
      const pr = f > 0 ? lr / f : 1;
      const pi = f > 0 ? li / f : 0;
      re[row + l] = pr * (f + g);
      im[row + l] = pi * (f + g);
      const h = sigma2 + g * f;
      reflectorNorm[i] = h;
      // P u = −e^{iφ} g e_l, so the new T[i][l] = −e^{−iφ} g · scale.
      magnitude = g * scale;
      cRe = -pr;
      cIm = pi;
      if (owed < 0) {
        qRe.fill(0, 0, l + 1);
        qIm.fill(0, 0, l + 1);
      }
      updateAndMultiply(n, l, owed < 0 ? row : owed, row, re, im, qRe, qIm, pRe, pIm);
      finishUpdateVector(l, row, h, re, im, pRe, pIm);
      [qRe, pRe] = [pRe, qRe];
      [qIm, pIm] = [pIm, qIm];
      owed = row;
    }
    off[l] = magnitude;
    // δ_{i−1} = δ_i · conj(c_i)/|c_i| turns conj(δ_i) c_i δ_{i−1} into |c_i|.
    const dRe = phaseRe[i];
    const dIm = phaseIm[i];
    phaseRe[l] = dRe * cRe + dIm * cIm;
    phaseIm[l] = dIm * cRe - dRe * cIm;
  }
  off[n - 1] = 0;
  for (let i = 0; i < n; i++) diag[i] = re[i * n + i];
}

function safeHypot(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  const big = x > y ? x : y;
  if (big === 0) return 0;
  const small = x > y ? y : x;
  const r = small / big;
  return big * Math.sqrt(1 + r * r);
}
