import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { fillHamiltonian } from "@/lib/tb/hamiltonian";
import { compileModel } from "@/lib/tb/model";
import { buildDocument } from "./helpers/build-document";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";
import { GALLIUM_ARSENIDE, voglDocument } from "./helpers/vogl-1983";

const demo = (name: string) => parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));
const rand = seededUniform(7);
const randomK = (d: number) => Array.from({ length: d }, () => rand() - 0.5);

function withSpinOrbit(): ModelDocument {
  const doc = voglDocument(GALLIUM_ARSENIDE);
  return { ...doc, spinOrbit: { As: 0.42, Ga: 0.17 }, conventions: { ...doc.conventions, spinLayout: "up-block-then-down-block" } };
}

const models = () => [
  ["demo-sp-chain", demo("demo-sp-chain")],
  ["demo-honeycomb-pz", demo("demo-honeycomb-pz")],
  ["demo-diamond-sp3s", demo("demo-diamond-sp3s")],
  ["GaAs sp3s* with spin–orbit", parseModelDocument(withSpinOrbit())],
] as const;

describe("symmetries of H(k)", () => {
  it("H(k) is Hermitian at random k", () => {
    for (const [name, doc] of models()) {
      const m = compileModel(doc);
      const n = m.size;
      const re = new Float64Array(n * n), im = new Float64Array(n * n);
      fillHamiltonian(m, randomK(m.dimension), re, im);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          expect(re[i * n + j], name).toBeCloseTo(re[j * n + i], 13);
          expect(im[i * n + j], name).toBeCloseTo(-im[j * n + i], 13);
        }
      }
    }
  });

  it("time reversal: E(k) = E(−k) (Kramers; no magnetic terms in these models)", () => {
    // Time-reversal symmetry maps k to −k (e.g. Ashcroft and Mermin (1976), ch. 9 / appendix on Kramers degeneracy).
    for (const [name, doc] of models()) {
      const m = compileModel(doc);
      for (let t = 0; t < 5; t++) {
        const k = randomK(m.dimension);
        const [ep, em] = computeBands(m, [k, k.map((x) => -x)]).energies;
        ep.forEach((e, i) => expect(em[i], name).toBeCloseTo(e, 10));
      }
    }
  });

  it("trace sum rule: the BZ average of Σ_n E_n(k) equals the sum of on-site energies", () => {
    // Tr H(k) = Σ_i ε_i + Σ_{R≠0} t_ii(R) e^{ik·R}; a uniform mesh averages the R ≠ 0 terms to zero
    // (orthogonality of plane waves on the Monkhorst–Pack mesh: Monkhorst and Pack, Phys. Rev. B 13, 5188 (1976)).
    for (const [name, doc] of models()) {
      const m = compileModel(doc);
      const n = 6;
      const mesh: number[][] = [];
      const count = n ** m.dimension;
      for (let c = 0; c < count; c++) mesh.push(Array.from({ length: m.dimension }, (_, i) => (Math.floor(c / n ** i) % n + 0.5) / n));
      const energies = computeBands(m, mesh).energies;
      const avg = energies.reduce((s, e) => s + e.reduce((a, b) => a + b, 0), 0) / mesh.length;
      const onsiteSum = Array.from(m.onsite).reduce((a, b) => a + b, 0);
      expect(avg, name).toBeCloseTo(onsiteSum, 9);
    }
  });

  it("spin–orbit on a free p shell: j = 3/2 at ε + λ/2 (×4) and j = 1/2 at ε − λ (×2)", () => {
    // L·S = [j(j+1) − l(l+1) − s(s+1)]/2 (e.g. J. J. Sakurai, Modern Quantum Mechanics (1985), §3.7).
    const [eps, lambda] = [0.8, 0.3];
    const doc = buildDocument({
      lattice: { dimension: 1, vectors: [[20, 0, 0]] },
      sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["px", "py", "pz"] }],
      onsite: { A: { px: eps, py: eps, pz: eps } },
      shells: [],
      spinOrbit: { A: lambda },
    });
    const [e] = computeBands(compileModel(parseModelDocument(doc)), [[0.17]]).energies;
    const expected = [eps - lambda, eps - lambda, eps + lambda / 2, eps + lambda / 2, eps + lambda / 2, eps + lambda / 2];
    expected.forEach((x, i) => expect(e[i]).toBeCloseTo(x, 12));
  });

  it("both Bloch phase conventions give the same eigenvalues", () => {
    // The two conventions differ by the diagonal unitary e^{ik·τ_i}, which leaves the spectrum unchanged.
    const doc = demo("demo-diamond-sp3s");
    const cell = { ...doc, conventions: { ...doc.conventions, blochPhase: "cell" as const } };
    const ks = [randomK(3), randomK(3)];
    const a = computeBands(compileModel(doc), ks).energies, b = computeBands(compileModel(cell), ks).energies;
    a.forEach((e, i) => e.forEach((x, j) => expect(b[i][j]).toBeCloseTo(x, 10)));
  });
});
