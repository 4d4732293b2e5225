import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { compileModel } from "@/lib/tb/model";
import { listParameters, setParameters } from "@/lib/tb/parameters";
import type { ModelDocument } from "@/lib/tb/document";
import { computeSensitivity, summariseSensitivity } from "@/lib/tb/analysis/sensitivity";
import { estimateParameterChange } from "@/lib/tb/analysis/parameter-change";
import { sChainDocument, zincBlendeDocument } from "./documents";

const energiesAt = (doc: ModelDocument, k: number[][]) => computeBands(compileModel(doc), k).energies;

// Generic k-points away from any symmetry element, so no level is degenerate.
const genericK = [[0.11, 0.23, 0.37], [0.41, -0.17, 0.06]];

describe("sensitivity ∂E/∂p (Hellmann–Feynman: Feynman, Phys. Rev. 56, 340 (1939))", () => {
  it("gives ∂E/∂t = 2·cos(2πk) and ∂E/∂ε = 1 for the s chain (analytic band E = ε + 2t·cos 2πk)", () => {
    const k = [[0], [0.1], [0.3]];
    const res = computeSensitivity(sChainDocument(0.5, -1), k);
    const keys = res.parameters.map((p) => p.key);
    const jt = keys.indexOf("shell/A-A/1/ss_sigma");
    const je = keys.indexOf("onsite/A/s");
    k.forEach(([x], i) => {
      expect(res.derivatives[i][jt]).toBeCloseTo(2 * Math.cos(2 * Math.PI * x), 10);
      expect(res.derivatives[i][je]).toBeCloseTo(1, 10);
    });
  });

  it("summarises the largest |∂E/∂p| per parameter in a window (chain: |2cos 2πk| ≤ 2, reached at Γ)", () => {
    const res = computeSensitivity(sChainDocument(0.5, -1), [[0], [0.2], [0.5]]);
    const summary = Object.fromEntries(summariseSensitivity(res).map((s) => [s.key, s.maxAbsDerivative]));
    expect(summary["shell/A-A/1/ss_sigma"]).toBeCloseTo(2, 12);
    expect(summary["onsite/A/s"]).toBeCloseTo(1, 12);
    // Window [−1, 0] eV keeps only k = 0.2 (E = 0.5 − 2cos 0.4π ≈ −0.118 eV; Γ at −1.5 and X at 2.5 fall outside).
    const windowed = summariseSensitivity(res, [-1, 0]).find((s) => s.key === "shell/A-A/1/ss_sigma");
    expect(windowed?.maxAbsDerivative).toBeCloseTo(2 * Math.cos(0.4 * Math.PI), 12);
  });

  it("agrees with central finite differences for every parameter of a zinc-blende sp3 model, with and without spin–orbit", () => {
    for (const doc of [zincBlendeDocument(), zincBlendeDocument({}, { A: 0.12, B: 0.34 })]) {
      const res = computeSensitivity(doc, genericK);
      const P = res.parameters.length;
      const h = 1e-5;
      res.parameters.forEach((p, j) => {
        const up = energiesAt(setParameters(doc, { [p.key]: p.value + h }), genericK);
        const down = energiesAt(setParameters(doc, { [p.key]: p.value - h }), genericK);
        up.forEach((levels, k) =>
          levels.forEach((e, n) => {
            // Kramers pairs with spin–orbit stay degenerate; finite differences of a sorted pair still agree.
            expect(res.derivatives[k][n * P + j]).toBeCloseTo((e - down[k][n]) / (2 * h), 5);
          }),
        );
      });
    }
  });

  it("sums to the trace of ∂H/∂p over the bands (Σ_n ∂E_n/∂ε = number of orbitals with that on-site energy)", () => {
    const doc = zincBlendeDocument();
    const gamma = [[0, 0, 0]];
    const res = computeSensitivity(doc, gamma, { keys: ["onsite/A/px", "onsite/B/s", "shell/A-B/1/pp_pi"] });
    const sum = (j: number) => Array.from({ length: 8 }, (_, n) => res.derivatives[0][n * 3 + j]).reduce((a, b) => a + b, 0);
    expect(sum(0)).toBeCloseTo(1, 10);
    expect(sum(1)).toBeCloseTo(1, 10);
    expect(sum(2)).toBeCloseTo(0, 10);
  });

  it("gives the one-sided derivative of degenerate levels (triply degenerate p states at Γ)", () => {
    const doc = zincBlendeDocument();
    const gamma = [[0, 0, 0]];
    const e0 = energiesAt(doc, gamma)[0];
    expect(e0[2] - e0[1]).toBeLessThan(1e-9);
    const key = "shell/A-B/1/pp_pi";
    const res = computeSensitivity(doc, gamma, { keys: [key] });
    const h = 1e-6;
    const value = listParameters(doc).find((p) => p.key === key)!.value;
    const up = energiesAt(setParameters(doc, { [key]: value + h }), gamma)[0];
    up.forEach((e, n) => expect(res.derivatives[0][n]).toBeCloseTo((e - e0[n]) / h, 4));
  });
});

describe("effect of a parameter change in a window", () => {
  it("estimates to first order and recomputes exactly; both agree for a small change", () => {
    const doc = zincBlendeDocument();
    const path = [[0, 0, 0], [0, 0.25, 0.25], [0.5, 0.5, 0.5], ...genericK];
    const small = estimateParameterChange(doc, { "shell/A-B/1/sp_sigma": 2.1 + 1e-4, "onsite/A/s": -8.3 - 2e-4 }, path);
    expect(small.exact.maxAbs).toBeGreaterThan(0);
    expect(small.firstOrder.maxAbs).toBeCloseTo(small.exact.maxAbs, 6);
    const large = estimateParameterChange(doc, { "shell/A-B/1/pp_sigma": 4.0 }, path, [-20, 0]);
    const bands = computeBands(compileModel(doc), path).energies;
    expect(bands[large.exact.kIndex][large.exact.band]).toBeLessThanOrEqual(0);
    const changed = computeBands(compileModel(setParameters(doc, { "shell/A-B/1/pp_sigma": 4.0 })), path).energies;
    expect(large.exact.maxAbs).toBeCloseTo(Math.abs(changed[large.exact.kIndex][large.exact.band] - bands[large.exact.kIndex][large.exact.band]), 12);
  });
});
