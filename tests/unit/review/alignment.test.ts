import { describe, expect, it } from "vitest";
import { alignedView, alignSeries, deltaE } from "@/lib/review/alignment";
import { buildBandView } from "@/lib/review/band-view";
import type { BandViewData } from "@/lib/review/band-view";
import { demoDiamond, referenceFrom, shiftedOnsite } from "./band-fixtures";

// Source under test: lib/review/alignment.ts (alignSeries, alignedView, deltaE).
const maxAbsDiff = (a: number[][], b: (number | null)[][]) => Math.max(...a.flatMap((row, k) => row.map((e, n) => Math.abs(e - (b[k][n] as number)))));

describe("alignment of base and references onto the proposed revision", () => {
  // H → H + c·1 moves every band, the VBM and the Fermi level by exactly c (analytic), so each alignment must undo it.
  const c = 0.3;
  const proposed = demoDiamond();
  const base = shiftedOnsite(proposed, c);
  const view = buildBandView(proposed, base, [{ id: "ref-1", name: "shifted reference", parsed: referenceFrom(proposed, -0.7, 0) }]);

  it("none leaves every energy as computed", () => {
    const a = alignSeries(view, "none", null);
    expect(a.base).toEqual(view.base);
    expect(a.proposed).toEqual(view.proposed);
    expect(a.references[0].energies).toEqual(view.references[0].energies);
    expect(maxAbsDiff(view.base as number[][], view.proposed)).toBeCloseTo(c, 9);
  });

  it("vbm makes the valence-band maxima meet", () => {
    const a = alignedView(view, "vbm", null);
    expect(a.baseVbm).toBeCloseTo(view.proposedVbm as number, 9);
    expect(maxAbsDiff(a.base as number[][], view.proposed)).toBeLessThan(1e-9);
    expect(maxAbsDiff(view.proposed, a.references[0].energies)).toBeLessThan(1e-9);
  });

  it("fermi uses the Fermi levels: the base's mesh Fermi level and the reference's stated one", () => {
    const a = alignedView(view, "fermi", null);
    expect(view.baseFermi! - view.proposedFermi!).toBeCloseTo(c, 6);
    expect(a.baseFermi).toBeCloseTo(view.proposedFermi as number, 9);
    // the reference states E_F = 0, so its shift is E_F(proposed) − 0
    const s = alignSeries(view, "fermi", null).shifts.references["ref-1"];
    expect(s).toBeCloseTo(view.proposedFermi as number, 12);
  });

  it("least-squares moves base and references by the mean difference, and says so", () => {
    const a = alignSeries(view, "least-squares", [-5, 2]);
    expect(a.shifts.base).toBeCloseTo(-c, 12);
    expect(a.shifts.references["ref-1"]).toBeCloseTo(0.7, 12);
    expect(a.shiftNote).toMatch(/base −0\.300 eV; shifted reference \+0\.700 eV/);
  });
});

describe("least-squares shift on hand-made series (analytic)", () => {
  const view: BandViewData = {
    path: { distance: [0, 1, 2], ticks: [{ index: 0, label: "A" }, { index: 2, label: "B" }], kFrac: [[0], [0.25], [0.5]] },
    proposed: [[-2, 1], [-1.5, 2], [-1, 3]],
    base: [[-2.2, 0.5], [-1.9, 1.0], [-1.0, 2.0]],
    references: [],
    baseFermi: null, proposedFermi: null, baseVbm: -1, proposedVbm: -1,
    dos: { energy: [], base: null, proposed: [] },
    electronCount: 2, spinDegeneracy: 2,
  };

  it("averages proposed − base over the pairs whose proposed energy lies in the window", () => {
    // window [−3, 0] keeps band 1 only: differences 0.2, 0.4, 0.0 → mean 0.2
    expect(alignSeries(view, "least-squares", [-3, 0]).shifts.base).toBeCloseTo(0.2, 12);
    // no window: all six differences 0.2, 0.5, 0.4, 1.0, 0.0, 1.0 → mean 3.1/6
    expect(alignSeries(view, "least-squares", null).shifts.base).toBeCloseTo(3.1 / 6, 12);
  });

  it("ΔE is proposed − base per band and the largest |ΔE| per k inside the window", () => {
    const d = deltaE(view);
    expect(d.perBandK.map((r) => r.map((x) => +x.toFixed(12)))).toEqual([[0.2, 0.5], [0.4, 1], [0, 1]]);
    expect(d.perK.map((x) => +x.toFixed(12))).toEqual([0.5, 1, 1]);
    expect(deltaE(view, [-3, 0]).perK.map((x) => +x.toFixed(12))).toEqual([0.2, 0.4, 0]);
    expect(deltaE({ ...view, base: null })).toEqual({ perK: [], perBandK: [] });
  });
});
