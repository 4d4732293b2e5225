import { describe, expect, it } from "vitest";
import { computeBandwidths, findBandGap } from "@/lib/tb/analysis/gaps";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { chainBand, dimerChainBands, lineSamples, squareBand } from "./band-models";

const path = lineSamples(40, true);
const ticks = [{ index: 0, label: "Γ" }, { index: 20, label: "X" }, { index: 40, label: "Γ" }];

describe("band gap", () => {
  it("finds the direct gap 2|v − w| at the zone boundary of the dimerised chain (Su, Schrieffer & Heeger, PRL 42, 1698 (1979))", () => {
    const v = 1;
    const w = 0.7;
    const res = findBandGap({ energies: path.map(dimerChainBands(v, w)), kFrac: path, electronCount: 2, spinDegeneracy: 2, ticks });
    if (res.kind !== "insulator") throw new Error("expected an insulator");
    expect(res.value).toBeCloseTo(2 * Math.abs(v - w), 10);
    expect(res.direct).toBe(true);
    expect(res.vbm.label).toBe("X");
    expect(res.cbm.kFrac[0]).toBeCloseTo(0.5, 12);
    expect(res.smallestDirect.value).toBeCloseTo(2 * Math.abs(v - w), 10);
  });

  it("reports an indirect gap with both k positions (valence max at Γ, conduction min at X; analytic cosine bands)", () => {
    const bands = (k: number[]) => Float64Array.of(-1 + 0.5 * Math.cos(2 * Math.PI * k[0]), 1 + 0.5 * Math.cos(2 * Math.PI * k[0]));
    const res = findBandGap({ energies: path.map(bands), kFrac: path, electronCount: 1, spinDegeneracy: 1, ticks });
    if (res.kind !== "insulator") throw new Error("expected an insulator");
    expect(res.value).toBeCloseTo(1, 12);
    expect(res.direct).toBe(false);
    expect(res.vbm.label).toBe("Γ");
    expect(res.cbm.label).toBe("X");
    expect(res.smallestDirect.value).toBeCloseTo(2, 12);
  });

  it("calls a half-filled band a metal, and overlapping bands a metal", () => {
    const half = findBandGap({ energies: path.map(chainBand(0, -1)), kFrac: path, electronCount: 1, spinDegeneracy: 2 });
    expect(half).toMatchObject({ kind: "metal", reason: "partially filled band" });
    // Valence max 1 at Γ above the conduction min 0.5 at X although E_c − E_v = 1.5 everywhere: a semimetal.
    const overlap = (k: number[]) => Float64Array.of(Math.cos(2 * Math.PI * k[0]), 1.5 + Math.cos(2 * Math.PI * k[0]));
    const res = findBandGap({ energies: path.map(overlap), kFrac: path, electronCount: 2, spinDegeneracy: 2 });
    expect(res).toMatchObject({ kind: "metal", reason: "bands overlap" });
  });
});

describe("bandwidths", () => {
  it("gives 4|t| for the chain and 8|t| for the square lattice (analytic cosine bands)", () => {
    expect(computeBandwidths(path.map(chainBand(0.2, -0.7)))[0].width).toBeCloseTo(2.8, 12);
    const mesh = monkhorstPackMesh([10, 10], { gammaCentred: true });
    const [w] = computeBandwidths(mesh.kFrac.map(squareBand(0, 1.5)));
    expect(w.width).toBeCloseTo(12, 12);
    expect(w.min).toBeCloseTo(-6, 12);
  });
});
