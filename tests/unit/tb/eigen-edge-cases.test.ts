import { describe, expect, it } from "vitest";
import { createEigenWorkspace, eigHermitian, eigvalsHermitian } from "@/lib/tb/eigen";

function solve(n: number, re: Float64Array, im: Float64Array) {
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  eigHermitian(n, re.slice(), im.slice(), values, vecRe, vecIm);
  return { values, vecRe, vecIm };
}

/** Periodic ring with hopping t·e^{iθ}: eigenvalues 2t·cos(2πm/n + θ) (circulant spectrum; Gray, Found. Trends
 *  Commun. Inf. Theory 2 (2006), §3.1). */
function ring(n: number, t: number, theta: number): { re: Float64Array; im: Float64Array; exact: number[] } {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    const k = (j + 1) % n;
    re[j * n + k] = re[k * n + j] = t * Math.cos(theta);
    im[j * n + k] = t * Math.sin(theta);
    im[k * n + j] = -t * Math.sin(theta);
  }
  const exact = Array.from({ length: n }, (_, m) => 2 * t * Math.cos((2 * Math.PI * m) / n + theta));
  return { re, im, exact: exact.sort((a, b) => a - b) };
}

describe("small and special matrices (definitions of eigenvalue and eigenvector)", () => {
  it("n = 0 is a no-op and n = 1 returns the diagonal entry with a unit vector", () => {
    eigvalsHermitian(0, new Float64Array(0), new Float64Array(0), new Float64Array(0));
    const s = solve(1, Float64Array.of(-3.5), Float64Array.of(0));
    expect(s.values[0]).toBe(-3.5);
    expect(Math.hypot(s.vecRe[0], s.vecIm[0])).toBeCloseTo(1, 15);
  });

  it("zero matrix: all eigenvalues zero, vectors orthonormal", () => {
    const n = 6;
    const s = solve(n, new Float64Array(n * n), new Float64Array(n * n));
    expect(Array.from(s.values)).toEqual(new Array(n).fill(0));
    for (let a = 0; a < n; a++) {
      for (let b = 0; b < n; b++) {
        let g = 0;
        for (let k = 0; k < n; k++) g += s.vecRe[k * n + a] * s.vecRe[k * n + b] + s.vecIm[k * n + a] * s.vecIm[k * n + b];
        expect(Math.abs(g - (a === b ? 1 : 0))).toBeLessThan(1e-15);
      }
    }
  });

  it("diagonal matrix: sorted diagonal, each vector a unit basis vector up to phase", () => {
    const diag = [3, -1, 7, -1, 0.5];
    const n = diag.length;
    const re = new Float64Array(n * n);
    diag.forEach((x, i) => (re[i * n + i] = x));
    const s = solve(n, re, new Float64Array(n * n));
    expect(Array.from(s.values)).toEqual(diag.slice().sort((a, b) => a - b));
    for (let j = 0; j < n; j++) {
      const home = diag.findIndex((x, i) => x === s.values[j] && Math.hypot(s.vecRe[i * n + j], s.vecIm[i * n + j]) > 0.5);
      expect(home).toBeGreaterThanOrEqual(0);
      for (let i = 0; i < n; i++) {
        if (diag[i] !== s.values[j]) expect(Math.hypot(s.vecRe[i * n + j], s.vecIm[i * n + j])).toBe(0);
      }
    }
  });

  // Eigenvalues are homogeneous of degree 1: λ(sH) = s·λ(H) (definition), checked far from unit scale.
  it.each([1e-300, 1e-150, 1e-20, 1e20, 1e150, 1e300])("scale %e keeps full relative accuracy", (scale) => {
    const n = 9;
    const { re, im, exact } = ring(n, scale, 0.4);
    const values = new Float64Array(n);
    eigvalsHermitian(n, re.slice(), im.slice(), values);
    for (let m = 0; m < n; m++) expect(Math.abs(values[m] - exact[m])).toBeLessThan(1e-13 * scale);
    const s = solve(n, re, im);
    for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - exact[m])).toBeLessThan(1e-13 * scale);
    let norm = 0;
    for (let k = 0; k < n; k++) norm += s.vecRe[k] ** 2 + s.vecIm[k] ** 2;
    expect(Math.abs(norm - 1)).toBeLessThan(1e-14);
  });

  it("only the lower triangle is read: the strict upper triangle may hold anything finite", () => {
    const { re, im, exact } = ring(5, -1.3, 0.2);
    for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) re[i * 5 + j] = im[i * 5 + j] = 42;
    const values = new Float64Array(5);
    eigvalsHermitian(5, re, im, values);
    for (let m = 0; m < 5; m++) expect(Math.abs(values[m] - exact[m])).toBeLessThan(1e-14);
  });
});

describe("errors instead of garbage", () => {
  const n = 3;
  const ok = () => ({ re: new Float64Array(n * n), im: new Float64Array(n * n), v: new Float64Array(n) });

  it("rejects size mismatches", () => {
    const { re, im, v } = ok();
    expect(() => eigvalsHermitian(n, re, new Float64Array(8), v)).toThrow(/im has length 8, expected 9/);
    expect(() => eigvalsHermitian(n, re, im, new Float64Array(2))).toThrow(/values has length 2/);
    expect(() => eigHermitian(n, re, im, v, new Float64Array(9), new Float64Array(4))).toThrow(/vecIm/);
    expect(() => eigvalsHermitian(2.5, re, im, v)).toThrow(/non-negative integer/);
    expect(() => eigvalsHermitian(n, re, im, v, createEigenWorkspace(4))).toThrow(/workspace is for n = 4/);
    expect(() => eigvalsHermitian(n, re, im, v, { n })).toThrow(/createEigenWorkspace/);
  });

  it.each([NaN, Infinity, -Infinity])("rejects a non-finite entry (%f)", (bad) => {
    const { re, im, v } = ok();
    im[2 * n + 1] = bad;
    expect(() => eigvalsHermitian(n, re, im, v)).toThrow(/non-finite/);
    expect(() => eigHermitian(n, re, im, v, new Float64Array(9), new Float64Array(9))).toThrow(/non-finite/);
  });
});
