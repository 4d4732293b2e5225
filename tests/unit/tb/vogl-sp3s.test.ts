import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { GALLIUM_ARSENIDE, SILICON, voglDocument, type VoglParameters } from "./helpers/vogl-1983";

const bands = (p: VoglParameters, ks: number[][]) => computeBands(compileModel(parseModelDocument(voglDocument(p))), ks).energies;
// Γ–X in the fcc reciprocal basis of the document: X = b1/2 + b3/2 = (2π/a)(0, 1, 0)
const gammaX = (n: number) => Array.from({ length: n + 1 }, (_, i) => [i / (2 * n), 0, i / (2 * n)]);

describe("sp3s* (Vogl, Hjalmarson and Dow, J. Phys. Chem. Solids 44, 365 (1983))", () => {
  it("reproduces the Γ-point closed forms of the Γ-point parameters", () => {
    // At Γ the s–p structure factor vanishes; each block is 2×2: (E_a + E_c)/2 ± sqrt(((E_a − E_c)/2)² + V²)
    // with V = V(s,s) for s and V(x,x) for each p (triply degenerate); s* stays at E(s*,a), E(s*,c) (Vogl et al. 1983, eq. for H(Γ)).
    for (const p of [SILICON, GALLIUM_ARSENIDE]) {
      const pair = (ea: number, ec: number, v: number) => [(ea + ec) / 2 - Math.hypot((ea - ec) / 2, v), (ea + ec) / 2 + Math.hypot((ea - ec) / 2, v)];
      const [s1, s2] = pair(p.esA, p.esC, p.vss);
      const [p1, p2] = pair(p.epA, p.epC, p.vxx);
      const expected = [s1, s2, p1, p1, p1, p2, p2, p2, p.essA, p.essC].sort((x, y) => x - y);
      const got = Array.from(bands(p, [[0, 0, 0]])[0]);
      expected.forEach((e, i) => expect(got[i]).toBeCloseTo(e, 10));
    }
  });

  it("silicon: indirect gap of about 1.17 eV with the conduction minimum along Γ–X", () => {
    // Vogl et al. (1983) fitted the gap of 1.17 eV (from memory); the measured conduction minimum of Si lies at
    // about 0.85 of Γ–X (from memory). We accept 0.7–0.9 for the model's minimum, not having its own value to hand.
    const path = gammaX(200);
    const e = bands(SILICON, path);
    const vbm = Math.max(...e.map((x) => x[3]));
    const cond = e.map((x) => x[4]);
    const cbm = Math.min(...cond);
    const where = cond.indexOf(cbm) / 200;
    expect(e[0][3]).toBeCloseTo(vbm, 10);
    expect(cbm - vbm).toBeGreaterThan(1.12);
    expect(cbm - vbm).toBeLessThan(1.22);
    expect(where).toBeGreaterThan(0.7);
    expect(where).toBeLessThan(0.9);
    expect(e[0][4] - vbm).toBeGreaterThan(cbm - vbm + 1);
  });

  it("gallium arsenide: direct gap of about 1.55 eV at Γ", () => {
    // Vogl et al. (1983) fitted E_g(GaAs) ≈ 1.55 eV at Γ (from memory); L and X conduction states lie higher.
    const e = bands(GALLIUM_ARSENIDE, [[0, 0, 0], [0.5, 0, 0.5], [0.5, 0.5, 0.5], ...gammaX(50)]);
    const gap = e[0][4] - e[0][3];
    expect(gap).toBeGreaterThan(1.5);
    expect(gap).toBeLessThan(1.6);
    for (const x of e) {
      expect(x[3]).toBeLessThanOrEqual(e[0][3] + 1e-9);
      expect(x[4]).toBeGreaterThanOrEqual(e[0][4] - 1e-9);
    }
  });

  it("the relative sign of the two s–p integrals matters: flipping one makes GaAs a metal at L", () => {
    // Only the product of sp_sigma and ps_sigma is gauge invariant; a wrong relative sign must show in the bands.
    const wrong = { ...GALLIUM_ARSENIDE, vpasc: -GALLIUM_ARSENIDE.vpasc, vpassc: -GALLIUM_ARSENIDE.vpassc };
    const [l] = bands(wrong, [[0.5, 0.5, 0.5]]);
    const [g] = bands(GALLIUM_ARSENIDE, [[0, 0, 0]]);
    expect(l[4]).toBeLessThan(g[3] + 0.5);
  });
});
