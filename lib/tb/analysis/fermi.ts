import type { LevelList, SpinDegeneracy } from "./constants";
import { gaussianOccupation } from "./gaussian";

/**
 * Fermi level from the electron count on a k-mesh.
 * "gaussian-smearing": bisection on N(μ) = g Σ_k w_k Σ_n ½erfc((E_nk − μ)/(√2σ)), the same broadening as the DOS.
 * "zero-temperature": fill states in energy order; in a gap μ is the mid-gap energy (insulators), in a band
 * it is the energy of the level that takes the last electron.
 */
export type FermiMethod = "gaussian-smearing" | "zero-temperature";

export interface FermiOptions {
  spinDegeneracy: SpinDegeneracy;
  method?: FermiMethod;
  /** Broadening for "gaussian-smearing", eV. Default 0.05 eV (common practice). */
  sigma?: number;
  weights?: ArrayLike<number>;
  /** Bisection tolerance on μ, eV. Default 1e-9. */
  tolerance?: number;
}

export interface FermiResult {
  energy: number;
  method: FermiMethod;
  sigma?: number;
  spinDegeneracy: SpinDegeneracy;
  electronCount: number;
  /** Highest occupied and lowest empty level (zero-temperature only). */
  highestOccupied?: number;
  lowestEmpty?: number;
}

export function findFermiLevel(energies: LevelList[], electronCount: number, opts: FermiOptions): FermiResult {
  if (energies.length === 0) throw new Error("fermi: no k-points");
  const g = opts.spinDegeneracy;
  const bandCount = energies[0].length;
  if (!(electronCount >= 0) || electronCount > g * bandCount + 1e-9) {
    throw new Error(`fermi: ${electronCount} electrons do not fit in ${bandCount} bands × ${g}`);
  }
  const weights = opts.weights ?? new Float64Array(energies.length).fill(1 / energies.length);
  const method = opts.method ?? "gaussian-smearing";
  const base = { method, spinDegeneracy: g, electronCount };
  if (method === "zero-temperature") return { ...base, ...fillLevels(energies, weights, electronCount / g) };
  const sigma = opts.sigma ?? 0.05;
  if (!(sigma > 0)) throw new Error("fermi: sigma must be positive");
  const count = (mu: number): number => {
    let n = 0;
    energies.forEach((levels, k) => {
      let s = 0;
      for (let i = 0; i < levels.length; i++) s += gaussianOccupation(levels[i], mu, sigma);
      n += weights[k] * s;
    });
    return g * n;
  };
  let lo = Infinity;
  let hi = -Infinity;
  for (const levels of energies) for (let i = 0; i < levels.length; i++) {
    lo = Math.min(lo, levels[i]);
    hi = Math.max(hi, levels[i]);
  }
  lo -= 20 * sigma;
  hi += 20 * sigma;
  const tol = opts.tolerance ?? 1e-9;
  while (hi - lo > tol) {
    const mid = 0.5 * (lo + hi);
    if (count(mid) < electronCount) lo = mid;
    else hi = mid;
  }
  return { ...base, energy: 0.5 * (lo + hi), sigma };
}

function fillLevels(energies: LevelList[], weights: ArrayLike<number>, statesToFill: number) {
  const levels: { e: number; w: number }[] = [];
  energies.forEach((list, k) => {
    for (let i = 0; i < list.length; i++) levels.push({ e: list[i], w: weights[k] });
  });
  levels.sort((a, b) => a.e - b.e);
  const eps = 1e-9;
  if (statesToFill <= eps) return { energy: levels[0].e, lowestEmpty: levels[0].e };
  let filled = 0;
  for (let i = 0; i < levels.length; i++) {
    filled += levels[i].w;
    if (filled >= statesToFill - eps) {
      const highestOccupied = levels[i].e;
      const lowestEmpty = i + 1 < levels.length ? levels[i + 1].e : undefined;
      const exactlyFull = Math.abs(filled - statesToFill) <= eps;
      const energy = exactlyFull && lowestEmpty !== undefined ? 0.5 * (highestOccupied + lowestEmpty) : highestOccupied;
      return { energy, highestOccupied, lowestEmpty };
    }
  }
  return { energy: levels.length > 0 ? levels[levels.length - 1].e : 0 };
}
