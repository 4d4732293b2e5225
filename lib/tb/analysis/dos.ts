import type { EnergySolver, LevelList } from "./constants";
import { gaussian } from "./gaussian";
import { monkhorstPackMesh, type MeshOptions } from "./mesh";

/**
 * Density of states from band energies on a k-mesh, each level broadened by a normalised Gaussian
 * (Fu & Ho, Phys. Rev. B 28, 5480 (1983); common practice). Normalised per cell to the basis size:
 * ∫ D(E) dE = number of bands (spin not counted, so a spin-degenerate basis holds 2 electrons per state).
 */
export interface DosOptions {
  /** Gaussian standard deviation, eV. Default 0.05 eV (common practice). */
  sigma?: number;
  energyMin?: number;
  energyMax?: number;
  /** Number of energy samples. Default 1001. */
  points?: number;
}

export interface DosResult {
  energy: Float64Array;
  /** States per eV per cell. */
  dos: Float64Array;
  sigma: number;
  bandCount: number;
  kPointCount: number;
}

export const DEFAULT_DOS_SIGMA = 0.05;

export function computeDos(energies: LevelList[], opts: DosOptions = {}, weights?: ArrayLike<number>): DosResult {
  if (energies.length === 0) throw new Error("dos: no k-points");
  const sigma = opts.sigma ?? DEFAULT_DOS_SIGMA;
  if (!(sigma > 0)) throw new Error("dos: sigma must be positive");
  const points = opts.points ?? 1001;
  if (!Number.isInteger(points) || points < 2) throw new Error("dos: at least 2 energy points");
  const bandCount = energies[0].length;
  let lo = Infinity;
  let hi = -Infinity;
  for (const levels of energies) {
    if (levels.length !== bandCount) throw new Error("dos: every k-point needs the same number of bands");
    for (let n = 0; n < bandCount; n++) {
      lo = Math.min(lo, levels[n]);
      hi = Math.max(hi, levels[n]);
    }
  }
  const eMin = opts.energyMin ?? lo - 5 * sigma;
  const eMax = opts.energyMax ?? hi + 5 * sigma;
  if (!(eMax > eMin)) throw new Error("dos: energyMax must exceed energyMin");
  const step = (eMax - eMin) / (points - 1);
  const energy = Float64Array.from({ length: points }, (_, i) => eMin + i * step);
  const dos = new Float64Array(points);
  const reach = 8 * sigma;
  energies.forEach((levels, k) => {
    const w = weights ? weights[k] : 1 / energies.length;
    for (let n = 0; n < bandCount; n++) {
      const e = levels[n];
      const first = Math.max(0, Math.ceil((e - reach - eMin) / step));
      const last = Math.min(points - 1, Math.floor((e + reach - eMin) / step));
      for (let i = first; i <= last; i++) dos[i] += w * gaussian(energy[i] - e, sigma);
    }
  });
  return { energy, dos, sigma, bandCount, kPointCount: energies.length };
}

/** DOS of a model given as an energy solver, on a Monkhorst–Pack mesh with the given divisions. */
export function computeDosOnMesh(
  solve: EnergySolver,
  divisions: number[],
  opts: DosOptions & MeshOptions = {},
): DosResult {
  const mesh = monkhorstPackMesh(divisions, opts);
  return computeDos(mesh.kFrac.map(solve), opts, mesh.weights);
}

/** Trapezoid integral of the DOS up to energy e (states per cell below e). */
export function integrateDos(result: DosResult, upTo = Infinity): number {
  const { energy, dos } = result;
  let sum = 0;
  for (let i = 1; i < energy.length && energy[i - 1] < upTo; i++) {
    const right = Math.min(energy[i], upTo);
    const h = right - energy[i - 1];
    const dRight = right === energy[i] ? dos[i] : dos[i - 1] + ((dos[i] - dos[i - 1]) * h) / (energy[i] - energy[i - 1]);
    sum += 0.5 * h * (dos[i - 1] + dRight);
  }
  return sum;
}
