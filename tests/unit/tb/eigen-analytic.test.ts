import { describe, expect, it } from "vitest";
import { eigHermitian } from "@/lib/tb/eigen";

type Solved = { values: Float64Array; vecRe: Float64Array; vecIm: Float64Array };

function solve(n: number, re: Float64Array, im: Float64Array): Solved {
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  eigHermitian(n, re.slice(), im.slice(), values, vecRe, vecIm);
  return { values, vecRe, vecIm };
}

/** max_j ‖H v_j − λ_j v_j‖ and max |VᴴV − I|, both evaluated directly from the definitions. */
function quality(n: number, re: Float64Array, im: Float64Array, s: Solved): { residual: number; orthogonality: number } {
  let residual = 0;
  let orthogonality = 0;
  for (let j = 0; j < n; j++) {
    let r2 = 0;
    for (let i = 0; i < n; i++) {
      let sr = -s.values[j] * s.vecRe[i * n + j];
      let si = -s.values[j] * s.vecIm[i * n + j];
      for (let k = 0; k < n; k++) {
        const ar = re[i * n + k], ai = im[i * n + k], xr = s.vecRe[k * n + j], xi = s.vecIm[k * n + j];
        sr += ar * xr - ai * xi;
        si += ar * xi + ai * xr;
      }
      r2 += sr * sr + si * si;
    }
    residual = Math.max(residual, Math.sqrt(r2));
    for (let m = 0; m < n; m++) {
      let gr = j === m ? -1 : 0;
      let gi = 0;
      for (let k = 0; k < n; k++) {
        const ar = s.vecRe[k * n + j], ai = s.vecIm[k * n + j], br = s.vecRe[k * n + m], bi = s.vecIm[k * n + m];
        gr += ar * br + ai * bi;
        gi += ar * bi - ai * br;
      }
      orthogonality = Math.max(orthogonality, Math.hypot(gr, gi));
    }
  }
  return { residual, orthogonality };
}

/** U = Φ F with F the unitary DFT matrix F_jk = e^{2πi jk/n}/√n and Φ a diagonal of phases e^{i·j²/3}. */
function knownUnitary(n: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    for (let k = 0; k < n; k++) {
      const angle = (2 * Math.PI * j * k) / n + (j * j) / 3;
      re[j * n + k] = Math.cos(angle) / Math.sqrt(n);
      im[j * n + k] = Math.sin(angle) / Math.sqrt(n);
    }
  }
  return { re, im };
}

/** H = U diag(λ) Uᴴ: its eigenvalues are λ and column k of U spans the eigenvector of λ_k (unitary similarity). */
function similarTo(lambda: number[]): { re: Float64Array; im: Float64Array } {
  const n = lambda.length;
  const u = knownUnitary(n);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sr = 0;
      let si = 0;
      for (let k = 0; k < n; k++) {
        const ar = u.re[i * n + k], ai = u.im[i * n + k], br = u.re[j * n + k], bi = -u.im[j * n + k];
        sr += lambda[k] * (ar * br - ai * bi);
        si += lambda[k] * (ar * bi + ai * br);
      }
      re[i * n + j] = sr;
      im[i * n + j] = i === j ? 0 : si;
    }
  }
  return { re, im };
}

describe("analytic spectra", () => {
  // Characteristic polynomial of [[a, b], [b̄, c]]: λ² − (a+c)λ + ac − |b|² = 0,
  // so λ± = (a+c)/2 ± √(((a−c)/2)² + |b|²) (elementary algebra).
  it.each([
    [2, 3, 1, 1],
    [0, 0, 0, 1],
    [1, 1, 0, 0],
    [-4, 7, 0.25, -3],
    [1e-3, -1e-3, 1e-9, 0],
  ])("2×2 [[%f, b], [b̄, %f]] with b = %f + %fi", (a, c, br, bi) => {
    const re = Float64Array.from([a, br, br, c]);
    const im = Float64Array.from([0, bi, -bi, 0]);
    const root = Math.sqrt(((a - c) / 2) ** 2 + br * br + bi * bi);
    const s = solve(2, re, im);
    const tol = 1e-15 * Math.max(1, Math.abs(a), Math.abs(c), root);
    expect(Math.abs(s.values[0] - ((a + c) / 2 - root))).toBeLessThan(tol);
    expect(Math.abs(s.values[1] - ((a + c) / 2 + root))).toBeLessThan(tol);
    const q = quality(2, re, im, s);
    expect(q.residual).toBeLessThan(tol * 4);
    expect(q.orthogonality).toBeLessThan(1e-15 * 4);
  });

  // Ring of n sites, on-site ε, hopping t·e^{iθ} from site j to j+1 (periodic): a circulant matrix whose
  // eigenvectors are plane waves e^{2πi mj/n} with eigenvalues ε + 2t·cos(2πm/n + θ)
  // (Gray, "Toeplitz and Circulant Matrices: A Review", Found. Trends Commun. Inf. Theory 2 (2006), §3.1).
  it.each([
    [3, 0, -1, 0],
    [8, 0.5, -2.7, 0],
    [12, 0, 1, 0.3],
    [31, -1, 0.8, Math.PI / 7],
    [40, 0, -1, 0],
  ])("ring n = %i, ε = %f, t = %f, θ = %f", (n, eps, t, theta) => {
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    for (let j = 0; j < n; j++) {
      const k = (j + 1) % n;
      re[j * n + j] = eps;
      re[j * n + k] = t * Math.cos(theta);
      im[j * n + k] = t * Math.sin(theta);
      re[k * n + j] = t * Math.cos(theta);
      im[k * n + j] = -t * Math.sin(theta);
    }
    const expected = Array.from({ length: n }, (_, m) => eps + 2 * t * Math.cos((2 * Math.PI * m) / n + theta));
    expected.sort((a, b) => a - b);
    const s = solve(n, re, im);
    for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - expected[m])).toBeLessThan(1e-13);
    const q = quality(n, re, im, s);
    expect(q.residual).toBeLessThan(1e-13);
    expect(q.orthogonality).toBeLessThan(1e-13);
  });

  it.each([7, 16, 33])("unitary similarity of a known diagonal, n = %i", (n) => {
    const lambda = Array.from({ length: n }, (_, k) => Math.sin(1 + 3 * k) * (k + 1));
    const { re, im } = similarTo(lambda);
    const s = solve(n, re, im);
    const sorted = lambda.slice().sort((a, b) => a - b);
    for (let k = 0; k < n; k++) expect(Math.abs(s.values[k] - sorted[k])).toBeLessThan(1e-12 * n);
    const q = quality(n, re, im, s);
    expect(q.residual).toBeLessThan(1e-12 * n);
    expect(q.orthogonality).toBeLessThan(1e-13);
  });

  // With a repeated eigenvalue only the eigenspace is defined: the projector Σ v vᴴ over the computed vectors
  // must equal U_S U_Sᴴ over the columns of the known U with that eigenvalue (unitary similarity).
  // Two sizes, so that both tridiagonal eigenvector solvers (QL below n = 16, inverse iteration above) are used.
  it.each([
    [[1, 1, 1, -2, -2, 5, 0, 0, 0, 0]],
    [[1, 1, 1, 1, 1, -2, -2, -2, -2, 0, 0, 0, 0, 0, 0, 3, 4.5, 4.5, 4.5, -7, 1, 0, -2, 2]],
  ])("degenerate spectrum %j: eigenvalues, and eigenspace projectors", (lambda) => {
    const n = lambda.length;
    const { re, im } = similarTo(lambda);
    const s = solve(n, re, im);
    const sorted = lambda.slice().sort((a, b) => a - b);
    for (let k = 0; k < n; k++) expect(Math.abs(s.values[k] - sorted[k])).toBeLessThan(1e-13);
    const q = quality(n, re, im, s);
    expect(q.residual).toBeLessThan(1e-13);
    expect(q.orthogonality).toBeLessThan(1e-13);
    const u = knownUnitary(n);
    for (const level of [1, -2, 0]) {
      const known = lambda.flatMap((x, k) => (x === level ? [k] : []));
      const found = Array.from(s.values).flatMap((x, k) => (Math.abs(x - level) < 1e-9 ? [k] : []));
      expect(found.length).toBe(known.length);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          let pr = 0, pi = 0;
          for (const k of known) {
            pr += u.re[i * n + k] * u.re[j * n + k] + u.im[i * n + k] * u.im[j * n + k];
            pi += u.im[i * n + k] * u.re[j * n + k] - u.re[i * n + k] * u.im[j * n + k];
          }
          for (const k of found) {
            pr -= s.vecRe[i * n + k] * s.vecRe[j * n + k] + s.vecIm[i * n + k] * s.vecIm[j * n + k];
            pi -= s.vecIm[i * n + k] * s.vecRe[j * n + k] - s.vecRe[i * n + k] * s.vecIm[j * n + k];
          }
          expect(Math.hypot(pr, pi)).toBeLessThan(1e-12);
        }
      }
    }
  });
});
