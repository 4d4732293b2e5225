import type { Alignment, ReferenceBands } from "./compare-reference";
import type { LmState } from "./levenberg-marquardt";

export interface BandFitProgress {
  iteration: number;
  cost: number;
  elapsedMs: number;
  /** Where the minimiser stands: resuming from it continues the fit exactly. */
  state: LmState;
}

/** Options shared by the band fit of a plain band model and of a document. */
export interface BandFitOptions {
  /** Window on the aligned reference energies, eV. */
  window?: [number, number];
  /** Model band n ↔ reference band n + bandOffset. */
  bandOffset?: number;
  /** Default "none". "fermi" would need a Fermi level that moves with the parameters and is refused. */
  alignment?: Alignment;
  /** Occupied model bands, required for "vbm". */
  occupiedBands?: number;
  /** Weight per reference band index (multiplies the squared error). Default 1. */
  bandWeights?: Record<number, number>;
  /** Weight per reference point, same shape as reference.energies (multiplies the squared error). */
  pointWeights?: number[][];
  lower?: number[];
  upper?: number[];
  maxIterations?: number;
  onProgress?: (p: BandFitProgress) => void;
  signal?: AbortSignal;
}

export class FitInputError extends Error {}

/** Refuses bad input before any work, with a message that says what is wrong. */
export function validateFitInput(
  names: string[],
  start: ArrayLike<number>,
  reference: ReferenceBands,
  opts: BandFitOptions,
): void {
  const fail = (msg: string): never => {
    throw new FitInputError(msg);
  };
  if (names.length === 0) fail("fit: choose at least one parameter to fit");
  if (new Set(names).size !== names.length) fail("fit: a parameter is listed twice");
  if (opts.alignment === "fermi") fail("fit: alignment 'fermi' is not available in a fit; use 'vbm', 'least-squares' or 'none'");
  if (reference.kFrac.length !== reference.energies.length) fail("fit: reference kFrac and energies have different lengths");
  if (reference.energies.length === 0) fail("fit: the reference has no k-points");
  reference.energies.forEach((row, k) =>
    row.forEach((e, b) => {
      if (e !== null && !Number.isFinite(e)) fail(`fit: reference energy at k-point ${k}, band ${b} is ${e} (NaN or infinite)`);
    }),
  );
  reference.kFrac.forEach((k, i) => {
    if (!k.every(Number.isFinite)) fail(`fit: reference k-point ${i} has a NaN or infinite coordinate`);
  });
  for (const [side, bound] of [["lower", opts.lower], ["upper", opts.upper]] as const) {
    if (bound && bound.length !== names.length) fail(`fit: ${side} bounds need one value per fitted parameter`);
  }
  names.forEach((name, i) => {
    const lo = opts.lower?.[i] ?? -Infinity;
    const hi = opts.upper?.[i] ?? Infinity;
    if (Number.isNaN(lo) || Number.isNaN(hi) || lo > hi) fail(`fit: bounds of ${name} are empty or NaN: [${lo}, ${hi}]`);
    if (!Number.isFinite(start[i])) fail(`fit: start value of ${name} is not finite`);
    if (start[i] < lo || start[i] > hi) fail(`fit: start value ${start[i]} of ${name} lies outside its bounds [${lo}, ${hi}]`);
  });
  for (const [band, w] of Object.entries(opts.bandWeights ?? {})) {
    if (!(w >= 0) || !Number.isFinite(w)) fail(`fit: weight of reference band ${band} must be finite and ≥ 0`);
  }
  opts.pointWeights?.forEach((row, k) =>
    row.forEach((w, b) => {
      if (!(w >= 0) || !Number.isFinite(w)) fail(`fit: point weight at k-point ${k}, band ${b} must be finite and ≥ 0`);
    }),
  );
  if (opts.alignment === "vbm" && !(opts.occupiedBands !== undefined && opts.occupiedBands >= 1)) {
    fail("fit: alignment 'vbm' needs occupiedBands ≥ 1");
  }
}

/** Second stage, once the selected points are known. */
export function validatePointCount(points: number, parameters: number, window?: [number, number]): void {
  if (points === 0) {
    throw new FitInputError(
      window ? `fit: the window [${window[0]}, ${window[1]}] eV holds no reference band energies` : "fit: no reference values are left to fit: the band offset, zero weights or missing values exclude them all",
    );
  }
  if (points <= parameters) {
    throw new FitInputError(`fit: ${points} reference points for ${parameters} free parameters; need more points than parameters`);
  }
}
