import type { HermitianScratch } from "./eigen-workspace";

/*
 * Reduction of a complex Hermitian matrix to a real symmetric tridiagonal one, and the matching
 * back-transformation of eigenvectors.
 * Method: Householder reflectors P = I − v vᴴ / h applied from the last row upwards on the lower triangle,
 * then a diagonal unitary phase D that makes the sub-diagonal real and non-negative.
 * Sources: Wilkinson & Reinsch, Handbook for Automatic Computation vol. II (1971), contributions II/2 (tred2)
 * and the complex variants htridi/htribk of EISPACK (Smith et al., Lecture Notes in Computer Science 6, 1976);
 * Golub & Van Loan, "Matrix Computations", 4th ed. (2013), §5.1 and §8.3.1.
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
  for (let i = n - 1; i >= 1; i--) {
    const l = i - 1;
    const row = i * n;
    let scale = 0;
    for (let k = 0; k <= l; k++) scale += Math.abs(re[row + k]) + Math.abs(im[row + k]);
    let cRe: number;
    let cIm: number;
    let magnitude: number;
    if (l === 0 || scale === 0) {
      reflectorNorm[i] = 0;
      magnitude = safeHypot(re[row + l], im[row + l]);
      cRe = magnitude > 0 ? re[row + l] / magnitude : 1;
      cIm = magnitude > 0 ? im[row + l] / magnitude : 0;
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
      applyReflectorBothSides(n, row, l, h, re, im, s);
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

/** B ← P B P for the leading (l+1)×(l+1) block B, via B − v qᴴ − q vᴴ with q = p − K v, p = B v / h. */
function applyReflectorBothSides(
  n: number, row: number, l: number, h: number, re: Float64Array, im: Float64Array, s: HermitianScratch,
): void {
  const pRe = s.tmpRe;
  const pIm = s.tmpIm;
  pRe.fill(0, 0, l + 1);
  pIm.fill(0, 0, l + 1);
  for (let j = 0; j <= l; j++) {
    const rj = j * n;
    const vr = re[row + j];
    const vi = im[row + j];
    let sr = 0;
    let si = 0;
    for (let k = 0; k < j; k++) {
      const ar = re[rj + k];
      const ai = im[rj + k];
      const wr = re[row + k];
      const wi = im[row + k];
      sr += ar * wr - ai * wi;
      si += ar * wi + ai * wr;
      pRe[k] += ar * vr + ai * vi;
      pIm[k] += ar * vi - ai * vr;
    }
    const djj = re[rj + j];
    pRe[j] += sr + djj * vr;
    pIm[j] += si + djj * vi;
  }
  const invH = 1 / h;
  let vp = 0;
  for (let k = 0; k <= l; k++) {
    pRe[k] *= invH;
    pIm[k] *= invH;
    vp += re[row + k] * pRe[k] + im[row + k] * pIm[k];
  }
  const half = 0.5 * vp * invH;
  for (let k = 0; k <= l; k++) {
    pRe[k] -= half * re[row + k];
    pIm[k] -= half * im[row + k];
  }
  for (let j = 0; j <= l; j++) {
    const rj = j * n;
    const vr = re[row + j];
    const vi = im[row + j];
    const qr = pRe[j];
    const qi = pIm[j];
    for (let k = 0; k <= j; k++) {
      const wr = re[row + k];
      const wi = im[row + k];
      const ur = pRe[k];
      const ui = pIm[k];
      re[rj + k] -= vr * ur + vi * ui + qr * wr + qi * wi;
      im[rj + k] -= vi * ur - vr * ui + qi * wr - qr * wi;
    }
  }
}

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

function safeHypot(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  const big = x > y ? x : y;
  if (big === 0) return 0;
  const small = x > y ? y : x;
  const r = small / big;
  return big * Math.sqrt(1 + r * r);
}
