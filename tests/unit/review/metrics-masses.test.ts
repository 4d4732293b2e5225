import { describe, expect, it } from "vitest";
import { DEFAULT_CONVENTIONS } from "@/lib/tb/conventions";
import { parseModelDocument } from "@/lib/tb/document";
import { buildMetrics } from "@/lib/review/metrics";

// Source under test: lib/review/metrics.ts (edge masses and the free-electron fit from lib/review/band-mass-rows.ts).
// ħ²/2mₑ = 3.80998 eV·Å² (CODATA 2018).
const HBAR2_2ME = 3.80998;

/**
 * Two independent s chains in one cell: species A (on-site εA, hopping tA) and B (εB, tB), no A–B hopping, lattice
 * constant a. Bands E = ε + 2t·cos(ka) (Ashcroft & Mermin, Solid State Physics (1976), ch. 10); with 2 electrons band A
 * is full, so the valence maximum is A's top at X (t < 0) and the conduction minimum is B's bottom at Γ.
 */
function twoChains(a: number, tA: number, tB: number, eA = 0, eB = 6) {
  return parseModelDocument({
    format: "bandgate-model",
    version: 1,
    name: "two chains",
    conventions: DEFAULT_CONVENTIONS,
    lattice: { dimension: 1, vectors: [[a, 0, 0]] },
    sites: [
      { label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] },
      { label: "B1", species: "B", position: [a / 2, 0, 0], orbitals: ["s"] },
    ],
    onsite: { A: { s: eA }, B: { s: eB } },
    shells: [
      { species: ["A", "A"], index: 1, distance: a, params: { ss_sigma: tA } },
      { species: ["B", "B"], index: 1, distance: a, params: { ss_sigma: tB } },
    ],
    electronCount: 2,
    kPath: { type: "custom", points: { "Γ": [0], X: [0.5] }, segments: [["Γ", "X"]], pointsTotal: 201 },
    validity: {},
    provenance: { referenceMethod: "analytic test model", structureSource: "analytic test model", citations: {} },
  });
}

const value = (rows: ReturnType<typeof buildMetrics>, key: string) => rows.find((r) => r.key === key)?.values.proposed ?? null;

describe("metrics: effective masses at the band edges along the path", () => {
  it("gives m* = ħ²/(2|t|a²) at the bottom of a cosine band and −ħ²/(2|t|a²) at its top (analytic)", () => {
    const [a, tA, tB] = [2.5, -1, -0.5];
    const rows = buildMetrics(twoChains(a, tA, tB), null, null, { window: null, alignment: "none" });
    // E = ε + 2t cos(ka) ⇒ d²E/dk² = −2t a² cos(ka): ±2|t|a² at the extrema, m* = ħ²/(d²E/dk²)
    expect(value(rows, "mass/cbm/Γ→X")).toBeCloseTo(HBAR2_2ME / (Math.abs(tB) * a * a), 3);
    expect(value(rows, "mass/vbm/X→Γ")).toBeCloseTo(-HBAR2_2ME / (Math.abs(tA) * a * a), 3);
    // gap = (εB − 2|tB|) − (εA + 2|tA|), indirect (top at X, bottom at Γ)
    expect(value(rows, "gap")).toBeCloseTo(6 - 1 - 2, 9);
    expect(rows.find((r) => r.key === "gap-character")?.proposed).toBe("indirect");
    expect(rows.find((r) => r.key === "gap-where")?.proposed).toBe("VBM X; CBM Γ");
  });

  it("fits the free-electron mass of the lowest band: a cosine band is the parabola ħ²k²/2m* to O(k⁴) near Γ", () => {
    // a = 1 Å, fit radius 0.2 Å⁻¹: 2|t|(1 − cos ka) = |t|a²k²(1 − (ka)²/12 + …), so the fitted mass lies within
    // (0.2)²/12 ≈ 0.3% of ħ²/(2|t|a²) (Taylor series; analytic)
    const [a, t] = [1, -1.3];
    const rows = buildMetrics(twoChains(a, t, -0.5, 0, 12), null, null, { window: null, alignment: "none" });
    const exact = HBAR2_2ME / (Math.abs(t) * a * a);
    const fitted = value(rows, "free-electron");
    expect(fitted).not.toBeNull();
    expect(Math.abs((fitted as number) / exact - 1)).toBeLessThan(0.004);
    expect((fitted as number) / exact).toBeGreaterThan(1);
  });
});
