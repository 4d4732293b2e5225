import type { ModelDocument } from "../document";
import { compileModel } from "../model";
import { mirrorBondKey } from "../orbitals";
import { listParameters, setParameters } from "../parameters";
import type { ReferenceBands } from "./compare-reference";
import { bandFitResultAt, fitBandModel, selectWeightedPairs, type DescentEnd, type FitModel, type FitResult } from "./fit";
import { FitInputError, validateFitInput, validatePointCount, type BandFitOptions } from "./fit-input";
import type { LmState } from "./levenberg-marquardt";
import { buildResiduals, type WeightedPair } from "./fit-residuals";
import { computeFitStatistics } from "./fit-statistics";
import { spinDegeneracyOf } from "./model-solver";
import { seededUniform } from "./seeded-uniform";
import { buildDerivativeModels, computeBandDerivatives } from "./sensitivity";

/**
 * Fit of chosen document parameters (keys from listParameters) to reference bands. The Jacobian is exact and cheap:
 * ∂E_n(k)/∂p by Hellmann–Feynman with the fixed ∂H/∂p models (H is linear in every parameter).
 */
export interface DocumentFitOptions extends Omit<BandFitOptions, "onProgress"> {
  onProgress?: (p: DocumentFitProgress) => void;
  /** Continue an interrupted fit of the same document, keys, reference and options from this checkpoint. */
  resume?: FitCheckpoint;
  /** Start values by key; default: the document's values. */
  start?: Record<string, number>;
  /**
   * Extra starts after the first, drawn from a seeded generator (see restartPoint): the best of all is kept.
   * Default 0. The same seed gives the same starts, so a stored fit re-runs to the same result.
   */
  restarts?: number;
  seed?: number;
}

export interface RestartOutcome {
  start: number[];
  status: FitResult["status"];
  cost: number;
  iterations: number;
}

/**
 * Where a document fit stands after an accepted step: the start in progress and its minimiser state, and how the
 * starts before it ended. Resuming from it gives, to the bit, the result the fit would have given without stopping.
 */
export interface FitCheckpoint {
  /** The start in progress: 0 for the document's values, then the seeded starts. */
  run: number;
  lm: LmState;
  /** How each start before it ended. */
  finished: DescentEnd[];
  /** Iterations over all starts so far, and the lowest cost reached. */
  iteration: number;
  cost: number;
  elapsedMs: number;
}

export interface DocumentFitProgress {
  iteration: number;
  cost: number;
  elapsedMs: number;
  checkpoint: FitCheckpoint;
}

export interface DocumentFitResult extends FitResult {
  /** The document with the best values. */
  document: ModelDocument;
  /** One entry per start (the first is the document's values). */
  starts: RestartOutcome[];
}

interface PreparedFit {
  start: number[];
  model: FitModel;
  options: BandFitOptions;
  withValues(p: ArrayLike<number>): ModelDocument;
}

function checkKeys(doc: ModelDocument, keys: string[]): Map<string, number> {
  const params = new Map(listParameters(doc).map((p) => [p.key, p.value]));
  for (const key of keys) {
    if (!params.has(key)) throw new FitInputError(`fit: unknown parameter key "${key}"`);
    const parts = key.split("/");
    const [a, b] = parts[0] === "shell" ? parts[1].split("-") : [];
    const mirror = parts[0] === "shell" ? `${parts.slice(0, 3).join("/")}/${mirrorBondKey(parts[3])}` : key;
    if (a === b && mirror !== key && params.has(mirror)) {
      throw new FitInputError(`fit: ${key} and ${mirror} are one integral in a one-species shell; keep only one of them in the document to fit it`);
    }
  }
  return params;
}

/** Checks keys and k-point dimensions and builds the band model of the chosen parameters. */
function prepareDocumentFit(doc: ModelDocument, keys: string[], reference: ReferenceBands, opts: DocumentFitOptions): PreparedFit {
  const params = checkKeys(doc, keys);
  const d = doc.lattice.dimension;
  reference.kFrac.forEach((k, i) => {
    if (k.length !== d) throw new FitInputError(`fit: reference k-point ${i} has ${k.length} components, the lattice has dimension ${d}`);
  });
  const start = keys.map((k) => opts.start?.[k] ?? (params.get(k) as number));
  const derivativeModels = buildDerivativeModels(doc, keys);
  const withValues = (p: ArrayLike<number>) => setParameters(doc, Object.fromEntries(keys.map((k, i) => [k, p[i]])));
  const occupiedBands = opts.occupiedBands ?? Math.round(doc.electronCount / spinDegeneracyOf(compileModel(doc)));
  return {
    start,
    model: { evaluate: (p) => computeBandDerivatives(compileModel(withValues(p)), derivativeModels, reference.kFrac) },
    options: { ...opts, onProgress: undefined, occupiedBands },
    withValues,
  };
}

export interface DocumentFitPreview {
  start: number[];
  /** Added to every reference energy (alignment at the start values). */
  shift: number;
  /** The points that enter the fit, with their weights. */
  pairs: WeightedPair[];
  /** Model bands at the reference k-points, at the start values. */
  energies: number[][];
  /**
   * Free parameters that change no residual at the start point: ∂E/∂p = 0 at every selected value, or a uniform
   * shift that the alignment takes up (an on-site energy under a least-squares shift). The fit cannot determine them.
   */
  insensitive: string[];
  /** True when the free parameters together are not determined (JᵀJ singular): some combination changes nothing. */
  undetermined: boolean;
}

/** What a fit would use, without running it; refuses the same bad input as fitDocument. */
export function previewDocumentFit(doc: ModelDocument, keys: string[], reference: ReferenceBands, opts: DocumentFitOptions = {}): DocumentFitPreview {
  const prepared = prepareDocumentFit(doc, keys, reference, opts);
  validateFitInput(keys, prepared.start, reference, prepared.options);
  const first = prepared.model.evaluate(Float64Array.from(prepared.start));
  const { shift, pairs } = selectWeightedPairs(first.energies, reference, prepared.options);
  validatePointCount(pairs.length, keys.length, opts.window);
  const P = keys.length;
  const { r, jac } = buildResiduals(first, pairs, reference, prepared.options, P);
  const columnNorm = (j: number) => Math.sqrt(pairs.reduce((acc, _, i) => acc + jac[i * P + j] ** 2, 0));
  const norms = keys.map((_, j) => columnNorm(j));
  const scale = Math.max(...norms, 1e-300);
  const insensitive = keys.filter((_, j) => norms[j] <= 1e-9 * scale || norms[j] < 1e-12);
  const undetermined = insensitive.length > 0 || computeFitStatistics(r, jac, P).covariance === null;
  return { start: prepared.start, shift, pairs, energies: first.energies.map((row) => Array.from(row)), insensitive, undetermined };
}


/**
 * A restart point: uniform within the bounds where both are finite, otherwise the start value moved by up to
 * ±25 % of its size (at least ±0.25 eV), clipped to any one-sided bound.
 */
export function restartPoint(start: number[], lower: number[] | undefined, upper: number[] | undefined, next: () => number): number[] {
  return start.map((x, i) => {
    const lo = lower?.[i] ?? -Infinity;
    const hi = upper?.[i] ?? Infinity;
    const u = next();
    if (Number.isFinite(lo) && Number.isFinite(hi)) return lo + u * (hi - lo);
    const span = Math.max(0.25 * Math.abs(x), 0.25);
    return Math.min(hi, Math.max(lo, x + (2 * u - 1) * span));
  });
}

export async function fitDocument(doc: ModelDocument, keys: string[], reference: ReferenceBands, opts: DocumentFitOptions = {}): Promise<DocumentFitResult> {
  const t0 = Date.now();
  const resume = opts.resume;
  const elapsed = () => (resume?.elapsedMs ?? 0) + Date.now() - t0;
  const prepared = prepareDocumentFit(doc, keys, reference, opts);
  const restarts = opts.restarts ?? 0;
  if (!Number.isInteger(restarts) || restarts < 0) throw new FitInputError("fit: restarts must be a whole number ≥ 0");
  if (resume && !(Number.isInteger(resume.run) && resume.run >= 0 && resume.run <= restarts && resume.finished.length === resume.run)) {
    throw new FitInputError("fit: the checkpoint does not belong to this fit");
  }
  const next = seededUniform(opts.seed ?? 1);
  let iterationsBefore = 0;
  let best: FitResult | null = null;
  let startRms = NaN;
  const starts: RestartOutcome[] = [];
  const ends: DescentEnd[] = [];
  for (let run = 0; run <= restarts; run++) {
    // Drawn for every start, also those finished before a resume, so the seeded sequence stays the same.
    const start = run === 0 ? prepared.start : restartPoint(prepared.start, opts.lower, opts.upper, next);
    const offset = iterationsBefore;
    const bestBefore = best === null ? Infinity : best.cost;
    const earlier = resume && run < resume.run ? resume.finished[run] : undefined;
    const result = earlier
      ? bandFitResultAt(prepared.model, keys, start, reference, prepared.options, earlier)
      : await fitBandModel(prepared.model, keys, start, reference, {
          ...prepared.options,
          resume: run === resume?.run ? resume.lm : undefined,
          onProgress:
            opts.onProgress &&
            ((p) => {
              const iteration = offset + p.iteration;
              const checkpoint = { run, lm: p.state, finished: [...ends], iteration, cost: Math.min(bestBefore, p.cost), elapsedMs: elapsed() };
              opts.onProgress?.({ iteration, cost: p.cost, elapsedMs: checkpoint.elapsedMs, checkpoint });
            }),
        });
    iterationsBefore += result.iterations;
    if (run === 0) startRms = result.startRms;
    starts.push({ start, status: result.status, cost: result.cost, iterations: result.iterations });
    ends.push({ status: result.status, reason: result.reason, values: result.values, iterations: result.iterations, cost: result.cost });
    best = pick(best, result);
    if (result.status === "cancelled") break;
  }
  const chosen = best as FitResult;
  return {
    ...chosen,
    status: starts.some((s) => s.status === "cancelled") ? "cancelled" : chosen.status,
    reason: starts.some((s) => s.status === "cancelled") ? "cancelled on request" : chosen.reason,
    start: prepared.start,
    startRms,
    iterations: iterationsBefore,
    elapsedMs: elapsed(),
    document: prepared.withValues(chosen.values),
    starts,
  };
}

/** The lower cost wins; a cancelled run only wins when nothing else has finished. */
function pick(best: FitResult | null, result: FitResult): FitResult {
  if (!best) return result;
  if (best.status === "cancelled" && result.status !== "cancelled") return result;
  return result.cost < best.cost ? result : best;
}
