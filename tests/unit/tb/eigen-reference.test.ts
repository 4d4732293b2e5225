import { complex, eigs, type Complex } from "mathjs";
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { createEigenWorkspace, eigHermitian, eigvalsHermitian } from "@/lib/tb/eigen";

/*
 * Cross-checks against two independent general-purpose libraries on seeded random Hermitian matrices
 * H = A + iB (A symmetric, B antisymmetric).
 */

function uniformSource(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296 - 0.5;
  };
}

function randomHermitian(n: number, seed: number): { re: Float64Array; im: Float64Array } {
  const next = uniformSource(seed);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    re[i * n + i] = 2 * next();
    for (let j = 0; j < i; j++) {
      const a = next();
      const b = next();
      re[i * n + j] = re[j * n + i] = a;
      im[i * n + j] = b;
      im[j * n + i] = -b;
    }
  }
  return { re, im };
}

/** Real symmetric 2n×2n embedding [[A, −B], [B, A]] of H = A + iB. */
function realEmbedding(n: number, re: Float64Array, im: Float64Array): Matrix {
  const m = new Matrix(2 * n, 2 * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      m.set(i, j, re[i * n + j]);
      m.set(i + n, j + n, re[i * n + j]);
      m.set(i, j + n, -im[i * n + j]);
      m.set(i + n, j, im[i * n + j]);
    }
  }
  return m;
}

describe("eigvalsHermitian against mathjs eigs (general complex eigen-solver)", () => {
  // Independent library: mathjs 15 `eigs`, which treats complex input as a general (non-Hermitian) matrix.
  it.each([2, 3, 6, 9, 12])("n = %i: same ascending eigenvalues", (n) => {
    const { re, im } = randomHermitian(n, 100 + n);
    const rows: Complex[][] = [];
    for (let i = 0; i < n; i++) {
      rows.push(Array.from({ length: n }, (_, j) => complex(re[i * n + j], im[i * n + j])));
    }
    const expected = (eigs(rows).values as unknown as Complex[]).map((z) => complex(z).re).sort((a, b) => a - b);
    const values = new Float64Array(n);
    eigvalsHermitian(n, re, im, values);
    for (let j = 0; j < n; j++) expect(values[j]).toBeCloseTo(expected[j], 9);
  });
});

describe("eigHermitian against ml-matrix on the real 2n×2n embedding", () => {
  // H = A + iB and [[A, −B], [B, A]] are related by a unitary similarity to H ⊕ conj(H), so every eigenvalue
  // of H appears exactly twice in the embedding, and x + iy ↦ [x; y] maps eigenvectors (Horn & Johnson,
  // "Matrix Analysis", 2nd ed., 2013, §1.3, problem on the real representation — from memory).
  // Independent library: ml-matrix 6 EigenvalueDecomposition (symmetric path: Householder + QL of JAMA).
  it.each([1, 2, 5, 13, 24, 40])("n = %i: eigenvalues twice, residuals, orthonormality", (n) => {
    const { re, im } = randomHermitian(n, 7 * n + 1);
    const embedding = realEmbedding(n, re, im);
    const reference = new EigenvalueDecomposition(embedding, { assumeSymmetric: true }).realEigenvalues
      .slice()
      .sort((a, b) => a - b);
    const values = new Float64Array(n);
    const vecRe = new Float64Array(n * n);
    const vecIm = new Float64Array(n * n);
    eigHermitian(n, re.slice(), im.slice(), values, vecRe, vecIm, createEigenWorkspace(n));
    const tol = 1e-12 * Math.max(1, Math.abs(reference[0]), Math.abs(reference[2 * n - 1]));
    for (let j = 0; j < n; j++) {
      expect(Math.abs(values[j] - reference[2 * j])).toBeLessThan(tol);
      expect(Math.abs(values[j] - reference[2 * j + 1])).toBeLessThan(tol);
    }
    // Residual ‖Hv − λv‖ evaluated by ml-matrix on the embedding with the stacked vector [Re v; Im v].
    const stacked = new Matrix(2 * n, n);
    for (let k = 0; k < n; k++) {
      for (let j = 0; j < n; j++) {
        stacked.set(k, j, vecRe[k * n + j]);
        stacked.set(k + n, j, vecIm[k * n + j]);
      }
    }
    const product = embedding.mmul(stacked);
    for (let j = 0; j < n; j++) {
      let r2 = 0;
      for (let k = 0; k < 2 * n; k++) r2 += (product.get(k, j) - values[j] * stacked.get(k, j)) ** 2;
      expect(Math.sqrt(r2)).toBeLessThan(tol);
    }
    // Orthonormality: the complex Gram matrix VᴴV = I, i.e. SᵀS = I and the cross term SᵀJS = 0 on the embedding.
    const gram = stacked.transpose().mmul(stacked);
    for (let a = 0; a < n; a++) {
      for (let b = 0; b < n; b++) {
        expect(Math.abs(gram.get(a, b) - (a === b ? 1 : 0))).toBeLessThan(1e-12);
        let cross = 0;
        for (let k = 0; k < n; k++) cross += vecRe[k * n + a] * vecIm[k * n + b] - vecIm[k * n + a] * vecRe[k * n + b];
        expect(Math.abs(cross)).toBeLessThan(1e-12);
      }
    }
  });

  it("eigenvalue-only and eigenvector paths agree, with and without a reused workspace", () => {
    const n = 17;
    const ws = createEigenWorkspace(n);
    const a = new Float64Array(n);
    const b = new Float64Array(n);
    const c = new Float64Array(n);
    for (let seed = 1; seed <= 3; seed++) {
      const { re, im } = randomHermitian(n, seed);
      eigvalsHermitian(n, re.slice(), im.slice(), a, ws);
      eigvalsHermitian(n, re.slice(), im.slice(), b);
      eigHermitian(n, re.slice(), im.slice(), c, new Float64Array(n * n), new Float64Array(n * n), ws);
      const reference = new EigenvalueDecomposition(realEmbedding(n, re, im), { assumeSymmetric: true })
        .realEigenvalues.slice().sort((x, y) => x - y);
      for (let j = 0; j < n; j++) {
        expect(a[j]).toBe(b[j]);
        expect(Math.abs(c[j] - a[j])).toBeLessThan(1e-13);
        expect(Math.abs(a[j] - reference[2 * j])).toBeLessThan(1e-12);
      }
    }
  });
});
