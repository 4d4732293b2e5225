import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { createEigenWorkspace, eigvalsHermitian } from "@/lib/tb/eigen";
import { fillHamiltonian, fillHamiltonianLower } from "@/lib/tb/hamiltonian";
import { compileModel, type CompiledModel } from "@/lib/tb/model";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";
import { GALLIUM_ARSENIDE, voglDocument } from "./helpers/vogl-1983";

/*
 * The lower-triangle build used by the band loops against the full build (every term scattered, its own phase
 * per displacement). The Bloch Hamiltonian is Hermitian (Slater & Koster, Phys. Rev. 94 (1954) 1498, eq. 3 with
 * its conjugate partner), so the terms above the diagonal carry no information the lower triangle lacks.
 */

const demo = (name: string) => parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));
const withSpinOrbit = (): ModelDocument => {
  const doc = voglDocument(GALLIUM_ARSENIDE);
  return { ...doc, spinOrbit: { As: 0.42, Ga: 0.17 }, conventions: { ...doc.conventions, spinLayout: "up-block-then-down-block" } };
};
const models = (): [string, CompiledModel][] => [
  ["sp chain, second neighbours (1-d)", compileModel(demo("demo-sp-chain"))],
  ["honeycomb pz (2-d)", compileModel(demo("demo-honeycomb-pz"))],
  ["diamond sp3s* (3-d)", compileModel(demo("demo-diamond-sp3s"))],
  ["GaAs sp3s* with spin–orbit", compileModel(parseModelDocument(withSpinOrbit()))],
];
const rand = seededUniform(2024);

describe("lower-triangle H(k) build", () => {
  it.each(models())("%s: lower triangle equals the full build bit for bit, zeros above", (_, m) => {
    const n = m.size;
    const fullRe = new Float64Array(n * n), fullIm = new Float64Array(n * n);
    const re = new Float64Array(n * n).fill(7), im = new Float64Array(n * n).fill(7);
    for (let trial = 0; trial < 20; trial++) {
      const k = Array.from({ length: m.dimension }, () => 2 * rand() - 1);
      fillHamiltonian(m, k, fullRe, fullIm);
      fillHamiltonianLower(m, k, re, im);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          if (j > i) {
            expect(re[i * n + j]).toBe(0);
            expect(im[i * n + j]).toBe(0);
            continue;
          }
          expect(re[i * n + j]).toBe(fullRe[i * n + j]);
          expect(im[i * n + j]).toBe(fullIm[i * n + j]);
          // Hermiticity: the dropped upper terms are the conjugates of the kept ones.
          expect(re[i * n + j]).toBeCloseTo(fullRe[j * n + i], 13);
          expect(im[i * n + j]).toBeCloseTo(-fullIm[j * n + i], 13);
        }
      }
    }
  });

  it.each(models())("%s: reads the k-point at an offset of a flat list", (_, m) => {
    const n = m.size, d = m.dimension;
    const flat = Float64Array.from({ length: 5 * d }, () => rand() - 0.5);
    const a = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
    const b = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
    for (let p = 0; p < 5; p++) {
      fillHamiltonianLower(m, flat, a.re, a.im, p * d);
      fillHamiltonianLower(m, Array.from(flat.subarray(p * d, p * d + d)), b.re, b.im);
      expect(a).toEqual(b);
    }
  });

  it("gives the same eigenvalues as the full matrix", () => {
    for (const [, m] of models()) {
      const n = m.size;
      const ws = createEigenWorkspace(n);
      const k = Array.from({ length: m.dimension }, () => rand() - 0.5);
      const full = { re: new Float64Array(n * n), im: new Float64Array(n * n), e: new Float64Array(n) };
      const lower = { re: new Float64Array(n * n), im: new Float64Array(n * n), e: new Float64Array(n) };
      fillHamiltonian(m, k, full.re, full.im);
      fillHamiltonianLower(m, k, lower.re, lower.im);
      eigvalsHermitian(n, full.re, full.im, full.e, ws);
      eigvalsHermitian(n, lower.re, lower.im, lower.e, ws);
      expect(lower.e).toEqual(full.e);
    }
  });

  it("rejects buffers that are too small", () => {
    const [, m] = models()[2];
    expect(() => fillHamiltonianLower(m, [0, 0, 0], new Float64Array(4), new Float64Array(4))).toThrow(/buffers need/);
  });
});
