import { computeAlignmentShift, selectReferencePairs, type BandError, type ReferenceBands } from "./compare-reference";
import { computeFitStatistics, type FitStatistics } from "./fit-statistics";
import { validateFitInput, validatePointCount, type BandFitOptions } from "./fit-input";
import { buildResiduals, type FitEvaluation, type WeightedPair } from "./fit-residuals";
import { minimiseLeastSquares, type LmState, type LmStatus } from "./levenberg-marquardt";

/**
 * Levenberg–Marquardt fit of a band model to reference bands (see levenberg-marquardt.ts for the method).
 * The reference points are chosen once, at the start values (window on the aligned reference, band offset,
 * weights ≠ 0), so the cost stays a smooth function of the parameters during the fit.
 */
export interface FitModel {
  evaluate(p: Float64Array): FitEvaluation;
}

export interface FitResult {
  status: LmStatus;
  reason: string;
  names: string[];
  start: number[];
  /** Best point found (the final point for "converged"). */
  values: number[];
  iterations: number;
  /** ½ Σ w·ΔE² at the best point. */
  cost: number;
  shift: number;
  points: number;
  /** Unweighted RMS error at the start values (same points), to show what the fit gained. */
  startRms: number;
  rms: number;
  maxAbs: number;
  perBand: BandError[];
  statistics: FitStatistics;
  elapsedMs: number;
}

/** Where one descent ended, enough to rebuild its FitResult without running it again. */
export interface DescentEnd {
  status: LmStatus;
  reason: string;
  values: number[];
  iterations: number;
  cost: number;
}

interface PreparedBandFit {
  model: FitModel;
  pairs: WeightedPair[];
  startRms: number;
}

/** The points of a descent, chosen at its start values, and the RMS error there. */
function prepareBandFit(model: FitModel, names: string[], start: number[], reference: ReferenceBands, opts: BandFitOptions): PreparedBandFit {
  validateFitInput(names, start, reference, opts);
  model = rememberLastTwo(model);
  const first = model.evaluate(Float64Array.from(start));
  if (first.energies.length !== reference.energies.length) throw new Error("fit: the model must be evaluated at the reference k-points");
  const { pairs } = selectWeightedPairs(first.energies, reference, opts);
  validatePointCount(pairs.length, names.length, opts.window);
  const startRms = errorsOf(buildResiduals(first, pairs, reference, opts, names.length).r, pairs).rms;
  return { model, pairs, startRms };
}

function resultAt(prep: PreparedBandFit, names: string[], start: number[], reference: ReferenceBands, opts: BandFitOptions, end: DescentEnd, t0: number): FitResult {
  const P = names.length;
  const final = buildResiduals(prep.model.evaluate(Float64Array.from(end.values)), prep.pairs, reference, opts, P);
  return {
    status: end.status,
    reason: end.reason,
    names,
    start: [...start],
    values: [...end.values],
    iterations: end.iterations,
    cost: end.cost,
    shift: final.shift,
    startRms: prep.startRms,
    ...errorsOf(final.r, prep.pairs),
    statistics: computeFitStatistics(final.r, final.jac, P),
    elapsedMs: Date.now() - t0,
  };
}

/** One descent from `start`; with `resume`, it continues from that state of the same descent. */
export async function fitBandModel(
  model: FitModel,
  names: string[],
  start: number[],
  reference: ReferenceBands,
  opts: BandFitOptions & { resume?: LmState } = {},
): Promise<FitResult> {
  const t0 = Date.now();
  const prep = prepareBandFit(model, names, start, reference, opts);
  const P = names.length;
  const lm = await minimiseLeastSquares(
    { evaluate: (p) => buildResiduals(prep.model.evaluate(p), prep.pairs, reference, opts, P), lower: bound(opts.lower, P, -Infinity), upper: bound(opts.upper, P, Infinity) },
    Float64Array.from(start),
    {
      maxIterations: opts.maxIterations,
      signal: opts.signal,
      resume: opts.resume,
      onProgress: opts.onProgress && ((p) => opts.onProgress?.({ iteration: p.iteration, cost: p.cost, elapsedMs: p.elapsedMs, state: p.state })),
    },
  );
  return resultAt(prep, names, start, reference, opts, { ...lm, values: Array.from(lm.parameters) }, t0);
}

/** The result of a descent that ended earlier (in an attempt that was interrupted later), without running it again. */
export function bandFitResultAt(model: FitModel, names: string[], start: number[], reference: ReferenceBands, opts: BandFitOptions, end: DescentEnd): FitResult {
  const t0 = Date.now();
  return resultAt(prepareBandFit(model, names, start, reference, opts), names, start, reference, opts, end, t0);
}

/**
 * The reference points that enter the fit and their weights, chosen at the start values: window on the aligned
 * reference, band offset, band weight × point weight, zero weights dropped. Also used by the preview.
 */
export function selectWeightedPairs(
  energies: FitEvaluation["energies"],
  reference: ReferenceBands,
  opts: BandFitOptions,
): { shift: number; pairs: WeightedPair[] } {
  const compareOpts = { ...opts, alignment: opts.alignment ?? "none" };
  const shift = computeAlignmentShift(energies, reference, compareOpts);
  const pairs = selectReferencePairs(energies, reference, shift, compareOpts)
    .map((p) => ({ ...p, weight: (opts.bandWeights?.[p.referenceBand] ?? 1) * (opts.pointWeights?.[p.k]?.[p.referenceBand] ?? 1) }))
    .filter((p) => p.weight > 0);
  return { shift, pairs };
}

/**
 * The start point is evaluated for the point selection and again by the minimiser, and the best point again for the
 * final errors (the minimiser's last evaluation may be a rejected trial): remembering the last two evaluations by
 * value saves both repeats.
 */
function rememberLastTwo(model: FitModel): FitModel {
  const kept: { p: Float64Array; value: FitEvaluation }[] = [];
  const same = (a: Float64Array, b: Float64Array) => a.length === b.length && a.every((x, i) => Object.is(x, b[i]));
  return {
    evaluate(p) {
      const hit = kept.find((k) => same(k.p, p));
      if (hit) return hit.value;
      const value = model.evaluate(p);
      kept.unshift({ p: Float64Array.from(p), value });
      kept.length = Math.min(kept.length, 2);
      return value;
    },
  };
}

function bound(values: number[] | undefined, n: number, fill: number): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => values?.[i] ?? fill);
}

/** Unweighted per-band RMS and max |ΔE| at the final point (residuals divided by √w). */
function errorsOf(r: Float64Array, pairs: WeightedPair[]): { points: number; rms: number; maxAbs: number; perBand: BandError[] } {
  const bands = new Map<number, BandError & { s2: number }>();
  let s2 = 0;
  let maxAbs = 0;
  pairs.forEach((p, i) => {
    const d = Math.abs(r[i] / Math.sqrt(p.weight));
    const b = bands.get(p.modelBand) ?? { modelBand: p.modelBand, referenceBand: p.referenceBand, points: 0, rms: 0, maxAbs: 0, s2: 0 };
    b.points++;
    b.s2 += d * d;
    b.maxAbs = Math.max(b.maxAbs, d);
    bands.set(p.modelBand, b);
    s2 += d * d;
    maxAbs = Math.max(maxAbs, d);
  });
  const perBand = [...bands.values()].sort((a, b) => a.modelBand - b.modelBand).map(({ s2: s, ...b }) => ({ ...b, rms: Math.sqrt(s / b.points) }));
  return { points: pairs.length, rms: Math.sqrt(s2 / pairs.length), maxAbs, perBand };
}
