import { describe, expect, it } from "vitest";
import { findFermiLevel } from "@/lib/tb/analysis/fermi";
import { gaussianOccupation } from "@/lib/tb/analysis/gaussian";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { chainBand } from "./band-models";

// Filling a cosine band E = ε + 2t·cos(2πk), t < 0, with N electrons (g per state) occupies |k| < k_F = N/(2g),
// so μ = ε + 2t·cos(2πk_F) (free-fermion filling; Ashcroft & Mermin, Solid State Physics (1976), ch. 2 and 10).
const eps = 0.3;
const t = -1;
const mesh = monkhorstPackMesh([4000]);
const energies = mesh.kFrac.map(chainBand(eps, t));

describe("Gaussian occupation", () => {
  // ½·erfc(x) at e − μ = √2·σ·x, against erf tabulated to 10 digits (Abramowitz & Stegun (1964), Table 7.1).
  const sigma = 0.05;
  const at = (x: number) => gaussianOccupation(Math.SQRT2 * sigma * x, 0, sigma);
  it("matches tabulated values", () => {
    expect(at(0)).toBeCloseTo(0.5, 10);
    expect(at(0.5)).toBeCloseTo(0.5 * (1 - 0.5204998778), 10);
    expect(at(1)).toBeCloseTo(0.5 * (1 - 0.8427007929), 10);
    expect(at(-1)).toBeCloseTo(0.5 * 1.8427007929, 10);
    expect(at(2)).toBeCloseTo(0.5 * (1 - 0.9953222650), 10);
  });
});

describe("Fermi level", () => {
  for (const method of ["zero-temperature", "gaussian-smearing"] as const) {
    it(`fills a quarter of the chain band with g = 2 (${method})`, () => {
      const res = findFermiLevel(energies, 0.5, { spinDegeneracy: 2, method, sigma: 0.01 });
      expect(res.method).toBe(method);
      expect(res.energy).toBeCloseTo(eps + 2 * t * Math.cos(2 * Math.PI * 0.125), 2);
    });
    it(`uses one electron per state with spin–orbit (g = 1) (${method})`, () => {
      const res = findFermiLevel(energies, 0.5, { spinDegeneracy: 1, method, sigma: 0.01 });
      expect(res.energy).toBeCloseTo(eps, 2);
    });
  }

  it("puts μ mid-gap for a filled valence band at T = 0", () => {
    const levels = mesh.kFrac.map((k) => {
      const e = chainBand(0, -0.2)(k)[0];
      return Float64Array.of(e - 2, e + 2);
    });
    const res = findFermiLevel(levels, 2, { spinDegeneracy: 2, method: "zero-temperature" });
    expect(res.highestOccupied).toBeCloseTo(-1.6, 6);
    expect(res.lowestEmpty).toBeCloseTo(1.6, 6);
    expect(res.energy).toBeCloseTo(0, 6);
    const smeared = findFermiLevel(levels, 2, { spinDegeneracy: 2, sigma: 0.05 });
    expect(Math.abs(smeared.energy)).toBeLessThan(1.6);
  });

  it("refuses more electrons than states", () => {
    expect(() => findFermiLevel(energies, 3, { spinDegeneracy: 2 })).toThrow(/do not fit/);
  });
});
