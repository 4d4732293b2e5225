import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { tridiagonalEigenvalues } from "@/lib/tb/eigen-tridiagonal-ql";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";

/*
 * The root-free QL step computes γ and the next p from one reciprocal 1/(p·t), falling back to plain divisions
 * when p·t leaves a safe range. Both branches are checked against ml-matrix (an independent implementation of
 * the classic tred2/tql2 pair) on matrices chosen to stress them. Backward-stable symmetric tridiagonal solvers
 * give absolute errors of order n·ε·‖T‖ (Golub & Van Loan, "Matrix Computations", 4th ed. (2013), §8.3 and
 * §8.4, from memory); the factor 4 on top is common practice.
 */

const EPS = Number.EPSILON;
const rand = seededUniform(99);

function reference(diag: number[], off: number[]): number[] {
  const n = diag.length;
  const t = Matrix.zeros(n, n);
  diag.forEach((x, i) => t.set(i, i, x));
  off.forEach((x, i) => {
    t.set(i, i + 1, x);
    t.set(i + 1, i, x);
  });
  return new EigenvalueDecomposition(t, { assumeSymmetric: true }).realEigenvalues.slice().sort((a, b) => a - b);
}

function ours(diag: number[], off: number[]): number[] {
  const n = diag.length;
  const d = Float64Array.from(diag), e = new Float64Array(n);
  e.set(off);
  tridiagonalEigenvalues(n, d, e);
  return Array.from(d).sort((a, b) => a - b);
}

function expectSameSpectrum(diag: number[], off: number[]): void {
  const n = diag.length;
  const norm = Math.max(...diag.map((x, i) => Math.abs(x) + Math.abs(off[i] ?? 0) + Math.abs(off[i - 1] ?? 0)));
  const got = ours(diag, off), want = reference(diag, off);
  got.forEach((x, i) => expect(Math.abs(x - want[i])).toBeLessThanOrEqual(4 * n * EPS * norm));
}

/** Wilkinson's W_m+: diagonal |m/2 − i|, off-diagonal 1 (Wilkinson, "The Algebraic Eigenvalue Problem", 1965, §5.45). */
const wilkinson = (m: number) => ({ diag: Array.from({ length: m }, (_, i) => Math.abs((m - 1) / 2 - i)), off: new Array<number>(m - 1).fill(1) });

describe("root-free QL eigenvalues against ml-matrix", () => {
  it.each([3, 10, 20, 40, 64])("random tridiagonal, n = %i", (n) => {
    for (let trial = 0; trial < 5; trial++) {
      expectSameSpectrum(Array.from({ length: n }, () => 2 * rand() - 1), Array.from({ length: n - 1 }, () => 2 * rand() - 1));
    }
  });

  it.each([21, 41])("W%i+ (pairs agreeing to many digits)", (m) => {
    const { diag, off } = wilkinson(m);
    expectSameSpectrum(diag, off);
  });

  it.each([1e-8, 1e-14])("glued W21+ copies (glue %e: tight clusters of eigenvalues)", (glue) => {
    const w = wilkinson(21);
    const diag = [...w.diag, ...w.diag, ...w.diag];
    const off = [...w.off, glue, ...w.off, glue, ...w.off];
    expectSameSpectrum(diag, off);
  });

  it("clustered: diagonal 1 ± tiny, weak coupling", () => {
    const n = 30;
    expectSameSpectrum(Array.from({ length: n }, () => 1 + 1e-12 * rand()), Array.from({ length: n - 1 }, () => 1e-9 * rand()));
  });

  // The upward grading drives p·t below the safe range in dozens of steps (checked once by counting them).
  it.each([
    ["graded downwards", (i: number) => 10 ** (-3 * i)],
    ["graded upwards", (i: number) => 10 ** (3 * i - 90)],
  ] as const)("%s over 90 orders of magnitude", (_, size) => {
    const n = 31;
    expectSameSpectrum(Array.from({ length: n }, (_, i) => size(i)), Array.from({ length: n - 1 }, (_, i) => size(i + 0.5)));
  });

  // ml-matrix itself under- or overflows at these scales, so the reference is the unscaled matrix (eigenvalues
  // scale linearly; rounding the scaled entries moves them by at most ε‖T‖, inside the tolerance).
  it.each([1e-300, 1e-160, 1e160, 1e300])("random n = 25 scaled by %e", (scale) => {
    const n = 25;
    const diag = Array.from({ length: n }, () => 2 * rand() - 1);
    const off = Array.from({ length: n - 1 }, () => 2 * rand() - 1);
    const norm = Math.max(...diag.map((x, i) => Math.abs(x) + Math.abs(off[i] ?? 0) + Math.abs(off[i - 1] ?? 0)));
    const want = reference(diag, off);
    const got = ours(diag.map((x) => x * scale), off.map((x) => x * scale));
    got.forEach((x, i) => expect(Math.abs(x / scale - want[i])).toBeLessThanOrEqual(4 * n * EPS * norm));
  });

  it("zeros on the off-diagonal split the matrix into blocks", () => {
    const diag = [3, 1, 2, 5, -1, 4, 0.5];
    const off = [0.7, 0, 1.1, 0.2, 0, 0.3];
    expectSameSpectrum(diag, off);
  });
});
