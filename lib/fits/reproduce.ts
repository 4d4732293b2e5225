import type { FitOutcome } from "./record";

export interface Reproduction {
  /** Every fitted value equal to the bit. */
  identical: boolean;
  /** Largest |difference| of a fitted value (eV). */
  maxDifference: number;
  sameEngine: boolean;
}

/** Compares a re-run with its original: a deterministic fit on the same engine reproduces every value exactly. */
export function compareReproduction(original: FitOutcome, rerun: FitOutcome, sameEngine: boolean): Reproduction {
  const maxDifference = original.values.reduce((m, v, i) => Math.max(m, Math.abs(v - (rerun.values[i] ?? NaN))), 0);
  const identical = original.names.length === rerun.names.length && original.values.every((v, i) => Object.is(v, rerun.values[i]));
  return { identical, maxDifference: Number.isNaN(maxDifference) ? Infinity : maxDifference, sameEngine };
}
