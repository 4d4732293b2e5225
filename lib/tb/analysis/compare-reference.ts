import { z } from "zod";
import type { LevelList } from "./constants";

/** Reference bands: energies[k][band] (eV), null where the reference has no value. */
export const referenceBandsSchema = z.object({
  kFrac: z.array(z.array(z.number())),
  energies: z.array(z.array(z.number().nullable())),
});
export type ReferenceBands = z.infer<typeof referenceBandsSchema>;

export type Alignment = "none" | "vbm" | "fermi" | "least-squares";

export interface ReferenceCompareOptions {
  alignment: Alignment;
  /** Window on the aligned reference energies, eV (model energy scale). */
  window?: [number, number];
  /** Model band n is compared with reference band n + bandOffset (e.g. semicore bands in the reference). */
  bandOffset?: number;
  /** Occupied model bands: required for "vbm" (reference VBM band = occupiedBands − 1 + bandOffset). */
  occupiedBands?: number;
  /** Both required for "fermi". */
  modelFermi?: number;
  referenceFermi?: number;
}

export interface BandError {
  modelBand: number;
  referenceBand: number;
  points: number;
  rms: number;
  maxAbs: number;
}

export interface ReferenceComparison {
  /** Added to every reference energy to align it with the model. */
  shift: number;
  alignment: Alignment;
  points: number;
  rms: number;
  maxAbs: number;
  perBand: BandError[];
  /** Model − aligned reference per k and model band; null where not compared. */
  delta: (number | null)[][];
}

export interface ReferencePair {
  k: number;
  modelBand: number;
  referenceBand: number;
}

/** The (k, band) pairs present in both, whose aligned reference energy lies in the window. */
export function selectReferencePairs(model: LevelList[], ref: ReferenceBands, shift: number, opts: ReferenceCompareOptions): ReferencePair[] {
  const offset = opts.bandOffset ?? 0;
  const [lo, hi] = opts.window ?? [-Infinity, Infinity];
  const pairs: ReferencePair[] = [];
  ref.energies.forEach((row, k) => {
    for (let n = Math.max(0, -offset); n < model[k].length && n + offset < row.length; n++) {
      const e = row[n + offset];
      if (e === null) continue;
      if (e + shift >= lo && e + shift <= hi) pairs.push({ k, modelBand: n, referenceBand: n + offset });
    }
  });
  return pairs;
}

export function computeAlignmentShift(model: LevelList[], ref: ReferenceBands, opts: ReferenceCompareOptions): number {
  switch (opts.alignment) {
    case "none":
      return 0;
    case "fermi":
      if (opts.modelFermi === undefined || opts.referenceFermi === undefined) {
        throw new Error("compare: alignment 'fermi' needs modelFermi and referenceFermi");
      }
      return opts.modelFermi - opts.referenceFermi;
    case "vbm": {
      if (opts.occupiedBands === undefined || opts.occupiedBands < 1) throw new Error("compare: alignment 'vbm' needs occupiedBands ≥ 1");
      const band = opts.occupiedBands - 1;
      const refBand = band + (opts.bandOffset ?? 0);
      let vm = -Infinity;
      let vr = -Infinity;
      ref.energies.forEach((row, k) => {
        const e = row[refBand];
        if (e === null || e === undefined || model[k][band] === undefined) return;
        vm = Math.max(vm, model[k][band]);
        vr = Math.max(vr, e);
      });
      if (!Number.isFinite(vm) || !Number.isFinite(vr)) throw new Error("compare: no valence-band values to align");
      return vm - vr;
    }
    case "least-squares":
      return leastSquaresShift(model, ref, opts);
  }
}

/** Mean model − reference over the window; iterated because the window moves with the shift. */
function leastSquaresShift(model: LevelList[], ref: ReferenceBands, opts: ReferenceCompareOptions): number {
  let shift = 0;
  for (let iter = 0; iter < 20; iter++) {
    const pairs = selectReferencePairs(model, ref, shift, opts);
    if (pairs.length === 0) throw new Error("compare: no reference values inside the window");
    let sum = 0;
    for (const p of pairs) sum += model[p.k][p.modelBand] - (ref.energies[p.k][p.referenceBand] as number);
    const next = sum / pairs.length;
    if (Math.abs(next - shift) < 1e-12) return next;
    shift = next;
  }
  return shift;
}

/** Model energies must be computed at ref.kFrac (same order). */
export function compareWithReference(model: LevelList[], ref: ReferenceBands, opts: ReferenceCompareOptions): ReferenceComparison {
  if (model.length !== ref.energies.length) throw new Error("compare: model energies must be given at the reference k-points");
  const shift = computeAlignmentShift(model, ref, opts);
  const pairs = selectReferencePairs(model, ref, shift, opts);
  const delta: (number | null)[][] = model.map((levels) => Array.from({ length: levels.length }, () => null));
  const bands = new Map<number, BandError & { sum2: number }>();
  let sum2 = 0;
  let maxAbs = 0;
  for (const p of pairs) {
    const d = model[p.k][p.modelBand] - ((ref.energies[p.k][p.referenceBand] as number) + shift);
    delta[p.k][p.modelBand] = d;
    const b = bands.get(p.modelBand) ?? { modelBand: p.modelBand, referenceBand: p.referenceBand, points: 0, rms: 0, maxAbs: 0, sum2: 0 };
    b.points++;
    b.sum2 += d * d;
    b.maxAbs = Math.max(b.maxAbs, Math.abs(d));
    bands.set(p.modelBand, b);
    sum2 += d * d;
    maxAbs = Math.max(maxAbs, Math.abs(d));
  }
  const perBand = [...bands.values()]
    .sort((a, b) => a.modelBand - b.modelBand)
    .map(({ sum2: s, ...b }) => ({ ...b, rms: Math.sqrt(s / b.points) }));
  return {
    shift,
    alignment: opts.alignment,
    points: pairs.length,
    rms: pairs.length > 0 ? Math.sqrt(sum2 / pairs.length) : 0,
    maxAbs,
    perBand,
    delta,
  };
}
