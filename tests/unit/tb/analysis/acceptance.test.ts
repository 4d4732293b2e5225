import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { compileModel } from "@/lib/tb/model";
import { samplePath } from "@/lib/tb/kpath";
import { ACCEPTANCE_CRITERION_SCHEMA, evaluateAcceptance } from "@/lib/tb/analysis/acceptance";
import { HBAR2_OVER_ME } from "@/lib/tb/analysis/constants";
import { createDocumentMetrics } from "@/lib/tb/analysis/metrics";
import { dimerChainDocument, honeycombDocument } from "./documents";

// Dimerised chain E = ±√(v² + w² + 2vw·cos ka) (Su, Schrieffer & Heeger, PRL 42, 1698 (1979)): direct gap
// 2|v − w| at X; band width |v + w| − |v − w|; near X, E ≈ |v − w| + vw·a²q²/(2|v − w|), so m*/mₑ = (ħ²/mₑ)|v − w|/(vw·a²).
const v = -1.2, w = -0.7, a = 3;
const doc = dimerChainDocument(v, w, 1.4, 1.6);

describe("acceptance criteria as data", () => {
  it("evaluates gap, character, bandwidth and mass against the analytic dimerised chain", () => {
    const mStar = (HBAR2_OVER_ME * Math.abs(v - w)) / (v * w * a * a);
    const results = evaluateAcceptance(
      [
        { metric: "gap", target: 1.0, tolerance: 0.01 },
        { metric: "gap", target: 1.17, tolerance: 0.05 },
        { metric: "gap-character", direct: true },
        { metric: "bandwidth", band: 0, target: Math.abs(v + w) - Math.abs(v - w), tolerance: 1e-6 },
        { metric: "mass", edge: "cbm", direction: [1, 0, 0], target: mStar, tolerance: 0.01 * mStar },
      ],
      createDocumentMetrics(doc),
    );
    expect(results.map((r) => r.status)).toEqual(["pass", "fail", "pass", "pass", "pass"]);
    expect(results[0].measured).toBeCloseTo(2 * Math.abs(v - w), 10);
    expect(results[0].id).toBe("acceptance-1-gap");
  });

  it("measures RMS and max error against reference bands, per band and in a window", () => {
    const path = samplePath(doc);
    const exact = computeBands(compileModel(doc), path.kFrac).energies;
    // Reference: band 0 exact, band 1 higher by 0.03 eV everywhere.
    const reference = { kFrac: path.kFrac, energies: exact.map((row) => [row[0], row[1] + 0.03]) };
    const metrics = createDocumentMetrics(doc, reference);
    const results = evaluateAcceptance(
      [
        { metric: "rms", band: 1, max: 0.05, alignment: "none" },
        { metric: "rms", band: 1, max: 0.02, alignment: "none" },
        { metric: "max-error", window: [-5, 0], max: 1e-9, alignment: "none" },
        { metric: "rms", max: 0.05 },
      ],
      metrics,
    );
    expect(results.map((r) => r.status)).toEqual(["pass", "fail", "pass", "pass"]);
    expect(results[0].measured).toBeCloseTo(0.03, 12);
    // VBM alignment (the default) shifts nothing here since band 0 is exact; band 1 is off by 0.03: RMS = 0.03/√2.
    expect(results[3].measured).toBeCloseTo(0.03 / Math.SQRT2, 12);
  });

  it("fails criteria that cannot be measured, and rejects malformed criteria", () => {
    // Graphene pz bands touch at K (Wallace, Phys. Rev. 71, 622 (1947)): no gap.
    const [gap, rms] = evaluateAcceptance([{ metric: "gap", target: 0, tolerance: 0.1 }, { metric: "rms", max: 0.1 }], createDocumentMetrics(honeycombDocument()));
    expect(gap.status).toBe("fail");
    expect(gap.detail).toMatch(/no gap: bands touch/);
    expect(rms.detail).toMatch(/no reference bands/);
    expect(ACCEPTANCE_CRITERION_SCHEMA.safeParse({ metric: "gap", target: 1 }).success).toBe(false);
    expect(ACCEPTANCE_CRITERION_SCHEMA.safeParse({ metric: "rms", window: [1, 0], max: 0.1 }).success).toBe(false);
  });
});
