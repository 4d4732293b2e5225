import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { runDocumentChecks } from "@/lib/tb/analysis/checks";
import { findBandGap } from "@/lib/tb/analysis/gaps";
import { computeEdgeMasses } from "@/lib/tb/analysis/masses";
import { createEnergySolver } from "@/lib/tb/analysis/model-solver";
import { GALLIUM_ARSENIDE, SILICON, voglDocument } from "../helpers/vogl-1983";

// sp3s* models of Vogl, Hjalmarson & Dow, J. Phys. Chem. Solids 44, 365 (1983), Table I (parameters from memory,
// see the helper). fcc points in the basis b1..b3 of a/2(0,1,1), a/2(1,0,1), a/2(1,1,0): X = (0, ½, ½), L = (½, ½, ½).
const line = (to: number[], n: number) => Array.from({ length: n + 1 }, (_, i) => to.map((x) => (x * i) / n));
const gammaX = line([0, 0.5, 0.5], 100);
const gammaL = line([0.5, 0.5, 0.5], 50).slice(1);
const kFrac = [...gammaX, ...gammaL];
const ticks = [{ index: 0, label: "Γ" }, { index: 100, label: "X" }, { index: 150, label: "L" }];

function gapOf(doc: ReturnType<typeof voglDocument>) {
  const energies = computeBands(compileModel(doc), kFrac).energies;
  return findBandGap({ energies, kFrac, electronCount: doc.electronCount, spinDegeneracy: 2, ticks });
}

describe("gap analysis on published sp3s* models", () => {
  it("finds the indirect silicon gap of about 1.17 eV with the conduction minimum on Γ–X (Vogl et al. 1983; 1.17 eV from memory)", () => {
    const gap = gapOf(voglDocument(SILICON));
    if (gap.kind !== "insulator") throw new Error("silicon should be an insulator");
    expect(gap.direct).toBe(false);
    expect(gap.value).toBeCloseTo(1.17, 1);
    expect(gap.vbm.label).toBe("Γ");
    expect(gap.cbm.kIndex).toBeGreaterThan(60);
    expect(gap.cbm.kIndex).toBeLessThan(95);
  });

  it("finds the direct GaAs gap of about 1.55 eV at Γ with an isotropic conduction mass there (cubic symmetry)", () => {
    const doc = voglDocument(GALLIUM_ARSENIDE);
    const gap = gapOf(doc);
    if (gap.kind !== "insulator") throw new Error("GaAs should be an insulator");
    expect(gap.direct).toBe(true);
    expect(gap.cbm.label).toBe("Γ");
    expect(gap.value).toBeCloseTo(1.55, 1);
    // In a cubic crystal the non-degenerate Γ conduction band is isotropic to second order in k
    // (Dresselhaus, Kip & Kittel, Phys. Rev. 98, 368 (1955)).
    const model = compileModel(doc);
    const masses = computeEdgeMasses(createEnergySolver(model), gap, [[1, 0, 0], [1, 1, 1], [1, 1, 0]], model.reciprocal);
    const [m100, m111, m110] = masses.conduction.map((m) => m.massRatio);
    expect(m100).toBeGreaterThan(0);
    expect(m111).toBeCloseTo(m100, 3);
    expect(m110).toBeCloseTo(m100, 3);
    masses.valence.forEach((m) => expect(m.carrier).toBe("hole-like"));
  });

  it("passes the physics checks on silicon, incl. the declared Γ25' triplet at the valence top", () => {
    // Diamond structure: valence top at Γ triply degenerate (Γ25'), e.g. Dresselhaus, Phys. Rev. 100, 580 (1955).
    const results = runDocumentChecks(voglDocument(SILICON), { degeneracies: [{ point: [0, 0, 0], bands: [1, 2, 3] }] });
    for (const r of results.filter((x) => x.id !== "outermost-shell")) expect(r.status, `${r.id}: ${r.detail}`).toBe("pass");
  });

  it("runs every check on the seed documents without a failure", () => {
    for (const name of ["demo-sp-chain", "demo-honeycomb-pz", "demo-diamond-sp3s"]) {
      const doc = parseModelDocument(JSON.parse(readFileSync(new URL(`../../../../db/seed/models/${name}.json`, import.meta.url), "utf8")));
      const results = runDocumentChecks(doc);
      for (const r of results) expect(r.status, `${name} ${r.id}: ${r.detail}`).not.toBe("fail");
    }
  });
});
