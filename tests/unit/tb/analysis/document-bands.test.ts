import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { compileModel } from "@/lib/tb/model";
import { samplePath } from "@/lib/tb/kpath";
import { integrateDos } from "@/lib/tb/analysis/dos";
import { HBAR2_OVER_2ME } from "@/lib/tb/analysis/constants";
import {
  compareDocuments,
  compareDocumentFreeElectron,
  compareDocumentWithReference,
  computeDocumentDos,
  findDocumentFermiLevel,
} from "@/lib/tb/analysis/document-bands";
import { honeycombDocument, sChainDocument } from "./documents";

describe("document-level band analysis", () => {
  it("gives ΔE = 2Δt·cos(2πk) between two chain documents on the base path (analytic cosine band)", () => {
    const res = compareDocuments(sChainDocument(0.5, -1), sChainDocument(0.5, -0.8));
    res.path.kFrac.forEach(([k], i) => expect(res.delta[i][0]).toBeCloseTo(0.4 * Math.cos(2 * Math.PI * k), 12));
    expect(res.maxAbs).toBeCloseTo(0.4, 12);
  });

  it("puts the Fermi level of half-filled graphene pz at the Dirac energy and the DOS minimum there (Wallace, Phys. Rev. 71, 622 (1947))", () => {
    const doc = honeycombDocument(-2.7);
    for (const method of ["zero-temperature", "gaussian-smearing"] as const) {
      expect(findDocumentFermiLevel(doc, { method, divisions: [60, 60] }).energy).toBeCloseTo(0, 6);
    }
    const dos = computeDocumentDos(doc, { divisions: [120, 120], sigma: 0.05, energyMin: -9, energyMax: 9, points: 1801 });
    expect(integrateDos(dos)).toBeCloseTo(2, 3);
    const at = (e: number) => dos.dos[Math.round((e + 9) / 0.01)];
    // Linear DOS at the Dirac point, van Hove peaks at ±|t|.
    expect(at(0)).toBeLessThan(0.1 * at(2.7));
    expect(at(2.7)).toBeGreaterThan(at(1.5));
    expect(at(-2.7)).toBeCloseTo(at(2.7), 6);
  });

  it("aligns a reference by Fermi levels with the model's computed one", () => {
    const doc = honeycombDocument(-2.7);
    const path = samplePath(doc);
    const exact = computeBands(compileModel(doc), path.kFrac).energies;
    const reference = { kFrac: path.kFrac, energies: exact.map((row) => Array.from(row, (e) => e - 0.7)) };
    const res = compareDocumentWithReference(doc, reference, { alignment: "fermi", referenceFermi: -0.7 });
    expect(res.shift).toBeCloseTo(0.7, 5);
    expect(res.rms).toBeLessThan(1e-5);
  });

  it("fits m* of the lowest chain band near Γ: ħ²/(2mₑ)/(−t·a²) from E ≈ ε + 2t − t·a²k² (Taylor expansion)", () => {
    const t = -1.5, a = 2.5;
    const radius = 0.1;
    const res = compareDocumentFreeElectron(sChainDocument(0.5, t, a), radius, 401);
    expect(res.pointsUsed).toBeGreaterThan(3);
    // The next Taylor term, +t·a⁴k⁴/12, lowers the fitted curvature by at most (a·radius)²/12 relative.
    const m0 = HBAR2_OVER_2ME / (-t * a * a);
    expect(res.massRatio).toBeGreaterThan(m0);
    expect((res.massRatio - m0) / m0).toBeLessThan((a * radius) ** 2 / 12);
    expect(res.deviation[0]).toBeCloseTo(0, 12);
  });
});
