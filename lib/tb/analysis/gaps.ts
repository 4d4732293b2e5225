import type { LevelList, SpinDegeneracy } from "./constants";

/** Band gap from the electron count at T = 0 on a set of k-points (usually the default path). */
export interface BandEdge {
  band: number;
  energy: number;
  kIndex: number;
  kFrac: number[];
  /** Tick label when the k-point is a labelled point of the path. */
  label?: string;
}

export type GapResult =
  | {
      kind: "insulator";
      value: number;
      direct: boolean;
      vbm: BandEdge;
      cbm: BandEdge;
      /** Smallest vertical gap over the k-points and where it is. */
      smallestDirect: { value: number; kIndex: number; kFrac: number[]; label?: string };
      occupiedBands: number;
    }
  | { kind: "metal"; reason: "partially filled band" | "bands overlap" | "bands touch"; occupiedBands: number; vbm?: BandEdge; cbm?: BandEdge };

/** Valence and conduction bands closer than this (eV) touch: a zero-gap semimetal, not an insulator. */
export const TOUCH_TOLERANCE = 1e-6;

export interface GapInput {
  energies: LevelList[];
  kFrac: number[][];
  electronCount: number;
  spinDegeneracy: SpinDegeneracy;
  ticks?: { index: number; label: string }[];
}

/** Two fractional k-points are the same crystal momentum when they differ by integers. */
export function sameKPoint(a: ArrayLike<number>, b: ArrayLike<number>, tol = 1e-6): boolean {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const d = (a[i] ?? 0) - (b[i] ?? 0);
    if (Math.abs(d - Math.round(d)) > tol) return false;
  }
  return true;
}

export function findBandGap(input: GapInput): GapResult {
  const { energies, kFrac, electronCount, spinDegeneracy } = input;
  if (energies.length === 0 || energies.length !== kFrac.length) throw new Error("gaps: energies and kFrac must match and be non-empty");
  const bandCount = energies[0].length;
  const filled = electronCount / spinDegeneracy;
  const occupiedBands = Math.round(filled);
  if (Math.abs(filled - occupiedBands) > 1e-9) return { kind: "metal", reason: "partially filled band", occupiedBands: Math.floor(filled) };
  if (occupiedBands < 1 || occupiedBands >= bandCount) {
    throw new Error(`gaps: ${occupiedBands} occupied bands of ${bandCount} leave no valence or no conduction band`);
  }
  const label = (k: number) => input.ticks?.find((t) => t.index === k)?.label;
  const edge = (band: number, pick: (a: number, b: number) => boolean): BandEdge => {
    let best = 0;
    for (let k = 1; k < energies.length; k++) if (pick(energies[k][band], energies[best][band])) best = k;
    return { band, energy: energies[best][band], kIndex: best, kFrac: kFrac[best], label: label(best) };
  };
  const vbm = edge(occupiedBands - 1, (a, b) => a > b);
  const cbm = edge(occupiedBands, (a, b) => a < b);
  if (cbm.energy < vbm.energy) return { kind: "metal", reason: "bands overlap", occupiedBands, vbm, cbm };
  if (cbm.energy - vbm.energy <= TOUCH_TOLERANCE) return { kind: "metal", reason: "bands touch", occupiedBands, vbm, cbm };
  let kd = 0;
  const vertical = (k: number) => energies[k][occupiedBands] - energies[k][occupiedBands - 1];
  for (let k = 1; k < energies.length; k++) if (vertical(k) < vertical(kd)) kd = k;
  const value = cbm.energy - vbm.energy;
  return {
    kind: "insulator",
    value,
    direct: vbm.kIndex === cbm.kIndex || sameKPoint(vbm.kFrac, cbm.kFrac) || vertical(kd) <= value + 1e-9,
    vbm,
    cbm,
    smallestDirect: { value: vertical(kd), kIndex: kd, kFrac: kFrac[kd], label: label(kd) },
    occupiedBands,
  };
}

export interface Bandwidth {
  band: number;
  min: number;
  max: number;
  width: number;
}

export function computeBandwidths(energies: LevelList[]): Bandwidth[] {
  if (energies.length === 0) return [];
  return Array.from({ length: energies[0].length }, (_, band) => {
    let min = Infinity;
    let max = -Infinity;
    for (const levels of energies) {
      min = Math.min(min, levels[band]);
      max = Math.max(max, levels[band]);
    }
    return { band, min, max, width: max - min };
  });
}
