import { describe, expect, it } from "vitest";
import { computeDos, computeDosOnMesh, integrateDos } from "@/lib/tb/analysis/dos";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { chainBand, squareBand } from "./band-models";

describe("Monkhorst–Pack mesh", () => {
  it("places q points at (2r − q − 1)/2q (Monkhorst & Pack, Phys. Rev. B 13, 5188 (1976), Eq. 3)", () => {
    const mesh = monkhorstPackMesh([4]);
    expect(mesh.kFrac.map((k) => k[0])).toEqual([-0.375, -0.125, 0.125, 0.375]);
    expect(monkhorstPackMesh([3]).kFrac.map((k) => k[0])).toEqual([-1 / 3, 0, 1 / 3]);
    const m3 = monkhorstPackMesh([2, 3, 4]);
    expect(m3.kFrac).toHaveLength(24);
    expect(m3.weights.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });
  it("refuses a zero division", () => {
    expect(() => monkhorstPackMesh([0])).toThrow(/positive integer/);
  });
});

describe("density of states", () => {
  it("matches the analytic 1D chain DOS 1/(π√(4t² − E²)) at the band centre", () => {
    // Analytic DOS of the nearest-neighbour chain: Economou, Green's Functions in Quantum Physics, 3rd ed. (2006), §5.2.
    const t = -1;
    const res = computeDosOnMesh(chainBand(0, t), [20000], { sigma: 0.02, energyMin: -0.5, energyMax: 0.5, points: 101 });
    const i = 50;
    expect(res.energy[i]).toBeCloseTo(0, 12);
    expect(res.dos[i]).toBeCloseTo(1 / (2 * Math.PI * Math.abs(t)), 3);
    const e = 0.4;
    const j = 90;
    expect(res.energy[j]).toBeCloseTo(e, 12);
    expect(res.dos[j]).toBeCloseTo(1 / (Math.PI * Math.sqrt(4 * t * t - e * e)), 3);
  });

  it("integrates to the basis size (normalisation)", () => {
    const twoBands = (k: number[]) => {
      const e = chainBand(0, -1)(k)[0];
      return Float64Array.of(e - 3, e + 3);
    };
    const res = computeDosOnMesh(twoBands, [400], { sigma: 0.05 });
    expect(integrateDos(res)).toBeCloseTo(2, 6);
  });

  it("puts half the states of the square lattice below the band centre (particle–hole symmetry of E = 2t(cos + cos))", () => {
    const res = computeDosOnMesh(squareBand(0, -1), [100, 100], { sigma: 0.05, points: 2001 });
    expect(integrateDos(res, 0)).toBeCloseTo(0.5, 3);
    expect(integrateDos(res)).toBeCloseTo(1, 6);
  });

  it("reduces to the normalised Gaussian for a dispersionless level (definition of the broadening)", () => {
    const sigma = 0.1;
    const res = computeDos([[1.5], [1.5]], { sigma, energyMin: 1, energyMax: 2, points: 11 });
    expect(res.dos[5]).toBeCloseTo(1 / (sigma * Math.sqrt(2 * Math.PI)), 10);
    expect(res.dos[6]).toBeCloseTo(Math.exp(-0.5) / (sigma * Math.sqrt(2 * Math.PI)), 10);
  });
});
