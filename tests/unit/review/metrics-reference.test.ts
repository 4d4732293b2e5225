import { describe, expect, it } from "vitest";
import { buildMetrics } from "@/lib/review/metrics";
import { demoDiamond, referenceFrom } from "./band-fixtures";

// Source under test: lib/review/metrics.ts (reference errors from lib/review/band-error-rows.ts).
const doc = demoDiamond();
const perBand = (rows: ReturnType<typeof buildMetrics>, kind: "rms" | "max") => rows.filter((r) => new RegExp(`^${kind}/\\d+$`).test(r.key));

describe("metrics: per-band errors against reference bands inside the window", () => {
  it("is zero for every band when the reference is made from the same document", () => {
    const rows = buildMetrics(doc, null, { id: "r", name: "same", parsed: referenceFrom(doc) }, { window: null, alignment: "none" });
    const rms = perBand(rows, "rms");
    expect(rms).toHaveLength(10);
    for (const r of [...rms, ...perBand(rows, "max")]) expect(r.values.proposed).toBeLessThan(1e-12);
  });

  it("equals a constant offset c in every band without alignment, and vanishes with least-squares or VBM alignment (analytic)", () => {
    const c = 0.25;
    const ref = { id: "r", name: "offset", parsed: referenceFrom(doc, c) };
    const none = buildMetrics(doc, null, ref, { window: null, alignment: "none" });
    for (const r of [...perBand(none, "rms"), ...perBand(none, "max")]) expect(r.values.proposed).toBeCloseTo(c, 12);
    for (const alignment of ["least-squares", "vbm"] as const) {
      const rows = buildMetrics(doc, null, ref, { window: null, alignment });
      // the shift added to the reference is −c: model − (reference − c) = 0
      expect(rows.find((r) => r.key === "shift")?.values.proposed).toBeCloseTo(-c, 12);
      for (const r of perBand(rows, "rms")) expect(r.values.proposed).toBeLessThan(1e-9);
    }
  });

  it("counts only the bands inside the window and compares the base release too", () => {
    const c = 0.1;
    const base = { ...doc, onsite: { X: { ...doc.onsite.X, "s*": doc.onsite.X["s*"] + 1 } } };
    const ref = { id: "r", name: "offset", parsed: referenceFrom(doc, c, 0.5) };
    const rows = buildMetrics(doc, base, ref, { window: [-13, 0.05], alignment: "none" });
    // the valence bands of the demo model lie below its VBM at 0 eV (Ep − |Vxx| = 1.6 − 1.6 at Γ): bands 1–4 only
    expect(perBand(rows, "rms").map((r) => r.key)).toEqual(["rms/1", "rms/2", "rms/3", "rms/4"]);
    for (const r of perBand(rows, "rms")) {
      expect(r.values.proposed).toBeCloseTo(c, 12);
      expect(r.values.base).not.toBeNull();
    }
  });

  it("says why a Fermi-level alignment is impossible when the reference states no Fermi level", () => {
    const rows = buildMetrics(doc, null, { id: "r", name: "no EF", parsed: referenceFrom(doc, 0, null) }, { window: null, alignment: "fermi" });
    expect(rows.find((r) => r.key === "reference-compare")?.proposed).toMatch(/no Fermi level/);
    expect(perBand(rows, "rms")).toHaveLength(0);
  });
});
