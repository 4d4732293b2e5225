import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { tridiagonalEigenvectorsByInverseIteration } from "@/lib/tb/eigen-inverse-iteration";
import { tridiagonalEigenvalues } from "@/lib/tb/eigen-tridiagonal-ql";
import { tridiagonalEigenvectors } from "@/lib/tb/eigen-tridiagonal-vectors";
import { HermitianScratch } from "@/lib/tb/eigen-workspace";

/* Both tridiagonal eigenvector solvers are tested directly: eigHermitian picks one by size and falls back to QL. */

type Solver = "QL" | "inverse iteration";

/** Returns eigenvalues and, per eigenvalue, its eigenvector (column j of the row-major z). */
function solveTridiagonal(solver: Solver, diag: number[], off: number[]): { values: number[]; z: Float64Array } {
  const n = diag.length;
  const s = new HermitianScratch(n);
  const d = Float64Array.from(diag);
  const e = new Float64Array(n);
  e.set(off);
  const z = new Float64Array(n * n);
  if (solver === "QL") {
    for (let i = 0; i < n; i++) z[i * n + i] = 1;
    tridiagonalEigenvectors(n, d, e, z, s);
  } else {
    expect(tridiagonalEigenvectorsByInverseIteration(n, d, e, z, s)).toBe(true);
  }
  return { values: Array.from(d), z };
}

function expectEigenpairs(diag: number[], off: number[], values: number[], z: Float64Array, tol: number): void {
  const n = diag.length;
  for (let j = 0; j < n; j++) {
    let r2 = 0;
    for (let i = 0; i < n; i++) {
      let t = (diag[i] - values[j]) * z[i * n + j];
      if (i > 0) t += off[i - 1] * z[(i - 1) * n + j];
      if (i < n - 1) t += off[i] * z[(i + 1) * n + j];
      r2 += t * t;
    }
    expect(Math.sqrt(r2)).toBeLessThan(tol);
    for (let m = 0; m < n; m++) {
      let g = 0;
      for (let i = 0; i < n; i++) g += z[i * n + j] * z[i * n + m];
      expect(Math.abs(g - (j === m ? 1 : 0))).toBeLessThan(tol);
    }
  }
}

const sorted = (a: number[]): number[] => a.slice().sort((x, y) => x - y);

describe.each<Solver>(["QL", "inverse iteration"])("tridiagonal eigenvectors by %s", (solver) => {
  // Open chain (tridiagonal Toeplitz): λ_k = ε + 2t·cos(πk/(n+1)), v_k(j) = √(2/(n+1))·sin(πjk/(n+1)), k = 1..n
  // (Noschese, Pasquini & Reichel, Numer. Linear Algebra Appl. 20 (2013) 302, §2).
  it.each([5, 30, 45])("open chain of %i sites", (n) => {
    const eps = 0.3;
    const t = -1.1;
    const diag = new Array(n).fill(eps);
    const off = new Array(n - 1).fill(t);
    const { values, z } = solveTridiagonal(solver, diag, off);
    const exact = Array.from({ length: n }, (_, k) => eps + 2 * t * Math.cos((Math.PI * (k + 1)) / (n + 1)));
    const got = sorted(values);
    const want = sorted(exact);
    for (let k = 0; k < n; k++) expect(Math.abs(got[k] - want[k])).toBeLessThan(1e-13);
    for (let j = 0; j < n; j++) {
      const k = Math.round(((n + 1) / Math.PI) * Math.acos((values[j] - eps) / (2 * t)));
      let overlap = 0;
      for (let i = 0; i < n; i++) overlap += z[i * n + j] * Math.sqrt(2 / (n + 1)) * Math.sin((Math.PI * (i + 1) * k) / (n + 1));
      expect(Math.abs(Math.abs(overlap) - 1)).toBeLessThan(1e-12);
    }
  });

  // Wilkinson's W21+ (diag |10 − i|, off-diagonal 1): its largest eigenvalues come in pairs that agree to
  // about 14 digits (Wilkinson, "The Algebraic Eigenvalue Problem", 1965, §5.45; λ_max ≈ 10.746194182903 from
  // memory), the classic hard case for separating eigenvectors. Independent eigenvalues: ml-matrix.
  it("Wilkinson W21+: near-degenerate pairs stay orthogonal", () => {
    const diag = Array.from({ length: 21 }, (_, i) => Math.abs(10 - i));
    const off = new Array(20).fill(1);
    const { values, z } = solveTridiagonal(solver, diag, off);
    const dense = Matrix.zeros(21, 21);
    diag.forEach((x, i) => dense.set(i, i, x));
    off.forEach((x, i) => {
      dense.set(i, i + 1, x);
      dense.set(i + 1, i, x);
    });
    const reference = sorted(new EigenvalueDecomposition(dense, { assumeSymmetric: true }).realEigenvalues);
    const got = sorted(values);
    for (let k = 0; k < 21; k++) expect(Math.abs(got[k] - reference[k])).toBeLessThan(1e-13);
    expect(Math.abs(got[20] - 10.746194182903)).toBeLessThan(1e-11);
    expect(got[20] - got[19]).toBeLessThan(1e-12);
    expectEigenpairs(diag, off, values, z, 1e-13);
  });

  // Two identical uncoupled blocks [[1, 1], [1, 1]] ⊕ (−2) ⊕ [[1, 1], [1, 1]]: eigenvalues 0, 0, 2, 2, −2 with
  // eigenvectors confined to their blocks (block-diagonal matrix; 2×2 characteristic polynomial λ² − 2λ).
  it("split matrix with eigenvalues repeated across blocks", () => {
    const diag = [1, 1, -2, 1, 1];
    const off = [1, 0, 0, 1];
    const { values, z } = solveTridiagonal(solver, diag, off);
    expect(sorted(values).map((x) => Math.round(x * 1e12) / 1e12)).toEqual([-2, 0, 0, 2, 2]);
    expectEigenpairs(diag, off, values, z, 1e-14);
    for (let j = 0; j < 5; j++) {
      const inFirst = Math.hypot(z[0 * 5 + j], z[1 * 5 + j]);
      const inLast = Math.hypot(z[3 * 5 + j], z[4 * 5 + j]);
      const inMiddle = Math.abs(z[2 * 5 + j]);
      expect([inFirst, inMiddle, inLast].filter((w) => w > 1 - 1e-14)).toHaveLength(1);
      expect(inFirst * inLast + inFirst * inMiddle + inLast * inMiddle).toBeLessThan(1e-15);
    }
  });
});

describe("tridiagonal eigenvalues only (root-free QL)", () => {
  it("open chain and W21+ agree with the analytic spectrum and ml-matrix", () => {
    const n = 37;
    const d = new Float64Array(n);
    const e = new Float64Array(n).fill(1);
    tridiagonalEigenvalues(n, d, e);
    const want = sorted(Array.from({ length: n }, (_, k) => 2 * Math.cos((Math.PI * (k + 1)) / (n + 1))));
    sorted(Array.from(d)).forEach((x, k) => expect(Math.abs(x - want[k])).toBeLessThan(1e-14));
    const w = Float64Array.from({ length: 21 }, (_, i) => Math.abs(10 - i));
    tridiagonalEigenvalues(21, w, new Float64Array(21).fill(1));
    expect(Math.abs(Math.max(...w) - 10.746194182903)).toBeLessThan(1e-11);
  });
});
