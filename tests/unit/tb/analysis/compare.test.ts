import { describe, expect, it } from "vitest";
import { compareBandSets } from "@/lib/tb/analysis/compare";
import { compareWithReference, type ReferenceBands } from "@/lib/tb/analysis/compare-reference";
import { chainBand, dimerChainBands, lineSamples } from "./band-models";

const path = lineSamples(20, true);

describe("document vs document", () => {
  it("gives ΔE = 2Δt·cos(2πk) when the chain hopping changes (analytic cosine band)", () => {
    const base = path.map(chainBand(0, -1));
    const proposed = path.map(chainBand(0, -1.1));
    const res = compareBandSets(base, proposed);
    path.forEach((k, i) => expect(res.delta[i][0]).toBeCloseTo(-0.2 * Math.cos(2 * Math.PI * k[0]), 12));
    expect(res.maxAbs).toBeCloseTo(0.2, 12);
    expect(res.maxAbsPerK[5]).toBeCloseTo(Math.abs(0.2 * Math.cos(Math.PI / 2)), 12);
    expect(res.bandCountChanged).toBe(false);
  });
});

describe("document vs reference bands", () => {
  const model = path.map(dimerChainBands(1, 0.6));
  // A reference with one extra deep band (index 0) and an energy zero 1.5 eV lower: band offset 1, shift +1.5.
  const reference: ReferenceBands = {
    kFrac: path,
    energies: model.map((m) => [-20, m[0] - 1.5, m[1] - 1.5]),
  };

  it("aligns by least-squares shift, VBM and Fermi level, then has zero error", () => {
    for (const opts of [
      { alignment: "least-squares" as const, bandOffset: 1 },
      { alignment: "vbm" as const, bandOffset: 1, occupiedBands: 1 },
      { alignment: "fermi" as const, bandOffset: 1, modelFermi: 0.25, referenceFermi: -1.25 },
    ]) {
      const res = compareWithReference(model, reference, opts);
      expect(res.shift).toBeCloseTo(1.5, 10);
      expect(res.rms).toBeLessThan(1e-10);
      expect(res.perBand.map((b) => [b.modelBand, b.referenceBand])).toEqual([[0, 1], [1, 2]]);
    }
  });

  it("reports per-band RMS and max error without alignment, inside the window only", () => {
    const noisy: ReferenceBands = { kFrac: path, energies: model.map((m, k) => [m[0] + (k % 2 ? 0.1 : -0.1), m[1] + 0.3]) };
    const res = compareWithReference(model, noisy, { alignment: "none", window: [-5, 0] });
    expect(res.perBand).toHaveLength(1);
    expect(res.perBand[0].rms).toBeCloseTo(0.1, 12);
    expect(res.perBand[0].maxAbs).toBeCloseTo(0.1, 12);
    expect(res.points).toBe(path.length);
    expect(res.delta[0][1]).toBeNull();
  });

  it("skips missing reference values and refuses a Fermi alignment without both levels", () => {
    const gappy: ReferenceBands = { kFrac: path, energies: model.map((m, k) => [k === 3 ? null : m[0], m[1]]) };
    expect(compareWithReference(model, gappy, { alignment: "none" }).points).toBe(2 * path.length - 1);
    expect(() => compareWithReference(model, gappy, { alignment: "fermi" })).toThrow(/modelFermi/);
  });
});
