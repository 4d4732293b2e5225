/*
 * Inner loops of the Householder tridiagonalisation (eigen-householder.ts), on the lower triangle of a
 * row-major complex matrix held as separate real and imaginary Float64Arrays.
 */

/** Rows from..to of the lower triangle −= v qᴴ + q vᴴ, with v stored at offset vRow. */
export function updateRows(
  n: number, from: number, to: number, vRow: number, re: Float64Array, im: Float64Array, qRe: Float64Array, qIm: Float64Array,
): void {
  for (let j = from; j <= to; j++) {
    const rj = j * n;
    const vr = re[vRow + j];
    const vi = im[vRow + j];
    const qr = qRe[j];
    const qi = qIm[j];
    for (let k = 0; k <= j; k++) {
      const wr = re[vRow + k];
      const wi = im[vRow + k];
      const ur = qRe[k];
      const ui = qIm[k];
      re[rj + k] -= vr * ur + vi * ui + qr * wr + qi * wi;
      im[rj + k] -= vi * ur - vr * ui + qi * wr - qr * wi;
    }
  }
}

/**
 * One pass over rows 0..l of the lower triangle: apply the owed update (v at vRow, q) and accumulate the
 * Hermitian product p = B x with x the new reflector at xRow (B is read from its lower triangle only).
 * Rows are taken in pairs so that each load of v, q, x and p serves two matrix rows.
 */
export function updateAndMultiply(
  n: number, l: number, vRow: number, xRow: number, re: Float64Array, im: Float64Array,
  qRe: Float64Array, qIm: Float64Array, pRe: Float64Array, pIm: Float64Array,
): void {
  pRe.fill(0, 0, l + 1);
  pIm.fill(0, 0, l + 1);
  let j = 0;
  for (; j < l; j += 2) {
    const r0 = j * n;
    const r1 = r0 + n;
    const v0r = re[vRow + j], v0i = im[vRow + j], q0r = qRe[j], q0i = qIm[j], x0r = re[xRow + j], x0i = im[xRow + j];
    const v1r = re[vRow + j + 1], v1i = im[vRow + j + 1], q1r = qRe[j + 1], q1i = qIm[j + 1];
    const x1r = re[xRow + j + 1], x1i = im[xRow + j + 1];
    let s0r = 0, s0i = 0, s1r = 0, s1i = 0;
    for (let k = 0; k < j; k++) {
      const wr = re[vRow + k], wi = im[vRow + k], ur = qRe[k], ui = qIm[k], yr = re[xRow + k], yi = im[xRow + k];
      const ar = re[r0 + k] - (v0r * ur + v0i * ui + q0r * wr + q0i * wi);
      const ai = im[r0 + k] - (v0i * ur - v0r * ui + q0i * wr - q0r * wi);
      const br = re[r1 + k] - (v1r * ur + v1i * ui + q1r * wr + q1i * wi);
      const bi = im[r1 + k] - (v1i * ur - v1r * ui + q1i * wr - q1r * wi);
      re[r0 + k] = ar;
      im[r0 + k] = ai;
      re[r1 + k] = br;
      im[r1 + k] = bi;
      s0r += ar * yr - ai * yi;
      s0i += ar * yi + ai * yr;
      s1r += br * yr - bi * yi;
      s1i += br * yi + bi * yr;
      pRe[k] += ar * x0r + ai * x0i + br * x1r + bi * x1i;
      pIm[k] += ar * x0i - ai * x0r + br * x1i - bi * x1r;
    }
    const br = re[r1 + j] - (v1r * q0r + v1i * q0i + q1r * v0r + q1i * v0i);
    const bi = im[r1 + j] - (v1i * q0r - v1r * q0i + q1i * v0r - q1r * v0i);
    re[r1 + j] = br;
    im[r1 + j] = bi;
    const d0 = re[r0 + j] - 2 * (v0r * q0r + v0i * q0i);
    const d1 = re[r1 + j + 1] - 2 * (v1r * q1r + v1i * q1i);
    re[r0 + j] = d0;
    re[r1 + j + 1] = d1;
    pRe[j] += s0r + d0 * x0r + br * x1r + bi * x1i;
    pIm[j] += s0i + d0 * x0i + br * x1i - bi * x1r;
    pRe[j + 1] += s1r + br * x0r - bi * x0i + d1 * x1r;
    pIm[j + 1] += s1i + br * x0i + bi * x0r + d1 * x1i;
  }
  if (j === l) {
    const rj = j * n;
    const vr = re[vRow + j], vi = im[vRow + j], qr = qRe[j], qi = qIm[j], xr = re[xRow + j], xi = im[xRow + j];
    let sr = 0, si = 0;
    for (let k = 0; k < j; k++) {
      const wr = re[vRow + k], wi = im[vRow + k], ur = qRe[k], ui = qIm[k];
      const ar = re[rj + k] - (vr * ur + vi * ui + qr * wr + qi * wi);
      const ai = im[rj + k] - (vi * ur - vr * ui + qi * wr - qr * wi);
      re[rj + k] = ar;
      im[rj + k] = ai;
      sr += ar * re[xRow + k] - ai * im[xRow + k];
      si += ar * im[xRow + k] + ai * re[xRow + k];
      pRe[k] += ar * xr + ai * xi;
      pIm[k] += ar * xi - ai * xr;
    }
    const djj = re[rj + j] - 2 * (vr * qr + vi * qi);
    re[rj + j] = djj;
    pRe[j] += sr + djj * xr;
    pIm[j] += si + djj * xi;
  }
}

/** q = p/h − K v with K = Re(vᴴp)/(2h²), so that P B P = B − v qᴴ − q vᴴ. */
export function finishUpdateVector(
  l: number, row: number, h: number, re: Float64Array, im: Float64Array, pRe: Float64Array, pIm: Float64Array,
): void {
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
}
