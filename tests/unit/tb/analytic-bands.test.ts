import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { parseModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { buildDocument, FCC } from "./helpers/build-document";

const bandsAt = (doc: ModelDocument, k: number[][]) => computeBands(compileModel(parseModelDocument(doc)), k).energies.map((e) => Array.from(e));

describe("one-dimensional chains", () => {
  // Analytic nearest-neighbour chain: E(k) = ε + 2t cos(ka), ka = 2π f (e.g. N. W. Ashcroft and N. D. Mermin,
  // Solid State Physics (1976), ch. 10, tight-binding s band).
  it("one s orbital: E = ε + 2t cos(2πf)", () => {
    const [eps, t, a] = [0.7, -1.3, 3.1];
    const doc = buildDocument({
      lattice: { dimension: 1, vectors: [[a, 0, 0]] },
      sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] }],
      onsite: { A: { s: eps } },
      shells: [{ species: ["A", "A"], index: 1, distance: a, params: { ss_sigma: t } }],
    });
    const fs = [0, 0.1, 0.25, 0.4, 0.5, -0.3];
    bandsAt(doc, fs.map((f) => [f])).forEach(([e], i) => expect(e).toBeCloseTo(eps + 2 * t * Math.cos(2 * Math.PI * fs[i]), 12));
  });

  // s + pz with the chain along z: H = [[εs + 2V_ssσ cos ka, 2i V_spσ sin ka], [c.c., εp + 2V_ppσ cos ka]] from the
  // Slater–Koster entries E_{s,z} = n V_spσ and E_{z,z} = n² V_ppσ (Slater & Koster, Phys. Rev. 94, 1498 (1954),
  // Table I) with n = ±1; the s–p mixing 2V_spσ sin ka vanishes at k = 0 and at the zone boundary.
  it("s + pz along the chain: 2×2 closed form, no s–p mixing at Γ and X", () => {
    const [es, ep, vss, vsp, vpp, a] = [-5, 1.5, -1.4, 1.8, 2.6, 2.5];
    const doc = buildDocument({
      lattice: { dimension: 1, vectors: [[0, 0, a]] },
      sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s", "pz"] }],
      onsite: { A: { s: es, pz: ep } },
      shells: [{ species: ["A", "A"], index: 1, distance: a, params: { ss_sigma: vss, sp_sigma: vsp, pp_sigma: vpp, pp_pi: -9 } }],
    });
    const fs = [0, 0.13, 0.25, 0.37, 0.5];
    bandsAt(doc, fs.map((f) => [f])).forEach((e, i) => {
      const ka = 2 * Math.PI * fs[i];
      const hss = es + 2 * vss * Math.cos(ka), hpp = ep + 2 * vpp * Math.cos(ka), hsp = 2 * vsp * Math.sin(ka);
      const mid = (hss + hpp) / 2, half = Math.sqrt(((hss - hpp) / 2) ** 2 + hsp ** 2);
      expect(e[0]).toBeCloseTo(mid - half, 12);
      expect(e[1]).toBeCloseTo(mid + half, 12);
    });
    const [gamma, x] = bandsAt(doc, [[0], [0.5]]);
    expect(gamma).toEqual([expect.closeTo(es + 2 * vss, 12), expect.closeTo(ep + 2 * vpp, 12)]);
    expect([...x].sort((p, q) => p - q)).toEqual([expect.closeTo(ep - 2 * vpp, 12), expect.closeTo(es - 2 * vss, 12)]);
  });
});

describe("honeycomb pz", () => {
  // P. R. Wallace, Phys. Rev. 71, 622 (1947): E = ±|t||1 + e^{ik·a1} + e^{ik·a2}|, zero at K, ±3|t| at Γ.
  const a = 2.46, t = -2.7;
  const doc = buildDocument({
    lattice: { dimension: 2, vectors: [[a, 0, 0], [a / 2, (a * Math.sqrt(3)) / 2, 0]] },
    sites: [
      { label: "C1", species: "C", position: [0, 0, 0], orbitals: ["pz"] },
      { label: "C2", species: "C", position: [a / 2, a / (2 * Math.sqrt(3)), 0], orbitals: ["pz"] },
    ],
    onsite: { C: { pz: 0 } },
    shells: [{ species: ["C", "C"], index: 1, distance: a / Math.sqrt(3), params: { pp_sigma: 5, pp_pi: t } }],
  });
  it("is zero at K and ±3|t| at Γ", () => {
    // with a1, a2 at 60°, K = b1/3 − b2/3, where 1 + e^{−2πi f1} + e^{−2πi f2} = 0
    const [gamma, k] = bandsAt(doc, [[0, 0], [1 / 3, -1 / 3]]);
    expect(gamma[0]).toBeCloseTo(-3 * Math.abs(t), 12);
    expect(gamma[1]).toBeCloseTo(3 * Math.abs(t), 12);
    expect(Math.abs(k[0])).toBeLessThan(1e-12);
    expect(Math.abs(k[1])).toBeLessThan(1e-12);
  });
  it("follows ±|t||f(k)| everywhere", () => {
    const ks = [[0.1, 0.27], [0.5, 0], [0.41, -0.2], [0.05, 0.6]];
    bandsAt(doc, ks).forEach((e, i) => {
      const [f1, f2] = ks[i];
      // sublattice sum with the a1, a2 of the document: |1 + e^{-2πi f1} + e^{-2πi f2}|
      const re = 1 + Math.cos(2 * Math.PI * f1) + Math.cos(2 * Math.PI * f2);
      const im = Math.sin(2 * Math.PI * f1) + Math.sin(2 * Math.PI * f2);
      const mod = Math.abs(t) * Math.hypot(re, im);
      expect(e[0]).toBeCloseTo(-mod, 12);
      expect(e[1]).toBeCloseTo(mod, 12);
    });
  });
});

describe("cubic s bands", () => {
  // Nearest-neighbour s bands (Ashcroft and Mermin (1976), ch. 10 and problem 10.2): simple cubic
  // E = ε + 2t Σ cos k_i a, width 12|t|; bcc E = ε + 8t cos(k_x a/2) cos(k_y a/2) cos(k_z a/2), width 16|t|;
  // fcc E = ε + 4t Σ_{i<j} cos(k_i a/2) cos(k_j a/2), from 12t at Γ to −4t at X, width 16|t|.
  const a = 4, t = -0.9;
  const cases: { name: string; vectors: [number, number, number][]; nn: number; width: number; formula: (k: number[]) => number }[] = [
    { name: "simple cubic", vectors: [[a, 0, 0], [0, a, 0], [0, 0, a]], nn: a, width: 12, formula: (k) => 2 * t * k.reduce((s, x) => s + Math.cos(x * a), 0) },
    {
      name: "bcc", vectors: [[-a / 2, a / 2, a / 2], [a / 2, -a / 2, a / 2], [a / 2, a / 2, -a / 2]], nn: (a * Math.sqrt(3)) / 2, width: 16,
      formula: (k) => 8 * t * Math.cos((k[0] * a) / 2) * Math.cos((k[1] * a) / 2) * Math.cos((k[2] * a) / 2),
    },
    {
      name: "fcc", vectors: FCC(a), nn: a / Math.SQRT2, width: 16,
      formula: (k) => {
        const c = k.map((x) => Math.cos((x * a) / 2));
        return 4 * t * (c[0] * c[1] + c[1] * c[2] + c[2] * c[0]);
      },
    },
  ];
  for (const c of cases) {
    it(`${c.name}: analytic dispersion and a width of ${c.width}|t|`, () => {
      const doc = buildDocument({
        lattice: { dimension: 3, vectors: c.vectors },
        sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] }],
        onsite: { A: { s: 0 } },
        shells: [{ species: ["A", "A"], index: 1, distance: c.nn, params: { ss_sigma: t } }],
      });
      const model = compileModel(parseModelDocument(doc));
      const mesh: number[][] = [];
      const n = 8;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let l = 0; l < n; l++) mesh.push([i / n, j / n, l / n]);
      const energies = computeBands(model, mesh).energies.map((e) => e[0]);
      mesh.forEach((f, i) => {
        const kc = [0, 1, 2].map((x) => f.reduce((s, fi, r) => s + fi * model.reciprocal[r][x], 0));
        expect(energies[i]).toBeCloseTo(c.formula(kc), 10);
      });
      expect(Math.max(...energies) - Math.min(...energies)).toBeCloseTo(c.width * Math.abs(t), 10);
    });
  }
});
