import { describe, expect, it } from "vitest";
import { HBAR2_OVER_2ME, HBAR2_OVER_ME } from "@/lib/tb/analysis/constants";
import { computeEffectiveMass } from "@/lib/tb/analysis/masses";
import { compareFreeElectron } from "@/lib/tb/analysis/free-electron";
import { kFracToCart } from "@/lib/tb/analysis/k-geometry";
import { chainBand, squareBand } from "./band-models";

// Square lattice with a = 2 Å: E = ε + 2t(cos k_x a + cos k_y a), so d²E/dk_x² = −2ta² at Γ and +2ta² at M
// (Taylor expansion of the analytic band); ħ²/mₑ = 7.61996 eV·Å² (CODATA 2018).
const a = 2;
const t = -1;
const reciprocal = [[(2 * Math.PI) / a, 0], [0, (2 * Math.PI) / a]];
const band = squareBand(0, t);

describe("effective masses", () => {
  it("gives m* = ħ²/(−2ta²) at Γ along x and along the diagonal", () => {
    const expected = HBAR2_OVER_ME / (-2 * t * a * a);
    for (const direction of [[1, 0], [1, 1]]) {
      const res = computeEffectiveMass(band, { band: 0, kFrac: [0, 0], direction, reciprocal });
      expect(res.carrier).toBe("electron-like");
      expect(res.massRatio).toBeCloseTo(expected, 3);
    }
  });

  it("gives a negative (hole-like) mass at the band maximum M", () => {
    const res = computeEffectiveMass(band, { band: 0, kFrac: [0.5, 0.5], direction: [0, 1], reciprocal });
    expect(res.carrier).toBe("hole-like");
    expect(res.massRatio).toBeCloseTo(HBAR2_OVER_ME / (2 * t * a * a), 3);
  });

  it("recovers the mass of an exact parabola E = ħ²k²/2m*", () => {
    const m = 0.067;
    const parabola = (k: number[]) => Float64Array.of((HBAR2_OVER_2ME / m) * Math.hypot(...kFracToCart(reciprocal, k)) ** 2);
    const res = computeEffectiveMass(parabola, { band: 0, kFrac: [0.1, -0.2], direction: [0.3, 0.4], reciprocal, step: 0.02 });
    expect(res.massRatio).toBeCloseTo(m, 8);
  });
});

describe("free-electron comparison", () => {
  it("recovers m* of a parabolic band exactly and shows zero deviation", () => {
    const m = 0.5;
    const rec = [[1.2, 0, 0]];
    const kFrac = Array.from({ length: 21 }, (_, i) => [i / 40]);
    const energies = kFrac.map((k) => 2 + (HBAR2_OVER_2ME / m) * (1.2 * k[0]) ** 2);
    const res = compareFreeElectron({ kFrac, energies, gammaEnergy: 2, reciprocal: rec, radius: 0.3 });
    expect(res.massRatio).toBeCloseTo(m, 10);
    expect(res.maxDeviationInRadius).toBeLessThan(1e-12);
  });

  it("finds m* = ħ²/(2mₑ)/(−ta²) for the chain near Γ and a growing deviation towards the zone edge", () => {
    // E = ε + 2t·cos(ka) ≈ ε + 2t − t·a²k² near Γ (Taylor expansion).
    const chainA = 3;
    const rec = [[(2 * Math.PI) / chainA]];
    const kFrac = Array.from({ length: 101 }, (_, i) => [i / 200]);
    const energies = kFrac.map((k) => chainBand(0, t)(k)[0]);
    const res = compareFreeElectron({ kFrac, energies, gammaEnergy: 2 * t, reciprocal: rec, radius: 0.05 });
    expect(res.massRatio).toBeCloseTo(HBAR2_OVER_2ME / (-t * chainA * chainA), 3);
    expect(Math.abs(res.deviation[100])).toBeGreaterThan(1);
    expect(() => compareFreeElectron({ kFrac: [[0]], energies: [0], gammaEnergy: 0, reciprocal: rec })).toThrow(/no samples/);
  });
});
