import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { deltaE } from "@/lib/review/alignment";
import { buildBandView } from "@/lib/review/band-view";
import { demoDiamond } from "./band-fixtures";

// Source under test: lib/review/band-view.ts (buildBandView) and lib/review/alignment.ts (deltaE).
describe("ΔE(k) of the band view", () => {
  it("equals proposed − base from independent computeBands runs of both documents on the proposed path", () => {
    const proposed = demoDiamond();
    const base = { ...proposed, shells: [{ ...proposed.shells[0], params: { ...proposed.shells[0].params, pp_pi: -0.75, sp_sigma: 2.55 } }] };
    const view = buildBandView(proposed, base, []);
    const kFrac = samplePath(proposed).kFrac;
    const a = computeBands(compileModel(base), kFrac).energies;
    const b = computeBands(compileModel(proposed), kFrac).energies;
    const { perBandK, perK } = deltaE(view);
    expect(perBandK).toHaveLength(kFrac.length);
    let largest = 0;
    perBandK.forEach((row, k) =>
      row.forEach((d, n) => {
        expect(d).toBeCloseTo(b[k][n] - a[k][n], 12);
        largest = Math.max(largest, Math.abs(b[k][n] - a[k][n]));
      }),
    );
    expect(Math.max(...perK)).toBeCloseTo(largest, 12);
    expect(largest).toBeGreaterThan(0.05);
  });

  it("places the valence-band maximum at Ep − |Vxx| (Γ-point p block, Vogl et al., J. Phys. Chem. Solids 44, 365 (1983))", () => {
    const doc = demoDiamond();
    const s = doc.shells[0].params as Record<string, number>;
    const vxx = (4 / 3) * s.pp_sigma + (8 / 3) * s.pp_pi;
    const view = buildBandView(doc, null, []);
    expect(view.proposedVbm).toBeCloseTo(doc.onsite.X.px - Math.abs(vxx), 9);
    expect(view.base).toBeNull();
    expect(view.dos.base).toBeNull();
    // ∫ DOS dE = number of bands per cell (spin not counted; Gaussian broadening keeps the area)
    const step = view.dos.energy[1] - view.dos.energy[0];
    expect(view.dos.proposed.reduce((s2, x) => s2 + x, 0) * step).toBeCloseTo(10, 2);
  });
});
