import type { LevelList, SpinDegeneracy } from "@/lib/tb/analysis/constants";

/** Bands filled at T = 0, or null when the electron count leaves a band partly filled (a metal by count). */
export function filledBands(electronCount: number, spinDegeneracy: SpinDegeneracy): number | null {
  const filled = electronCount / spinDegeneracy;
  const n = Math.round(filled);
  return Math.abs(filled - n) < 1e-9 && n >= 1 ? n : null;
}

/** Highest energy of the top filled band over the given k-points (values may be missing in reference sets). */
export function valenceMaximum(energies: readonly (readonly (number | null)[] | LevelList)[], occupiedBands: number | null): number | null {
  if (occupiedBands === null) return null;
  let top = -Infinity;
  for (const row of energies) {
    const e = row[occupiedBands - 1];
    if (e !== null && e !== undefined && Number.isFinite(e)) top = Math.max(top, e);
  }
  return Number.isFinite(top) ? top : null;
}
