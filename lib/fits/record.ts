import type { FitResult } from "@/lib/tb/analysis/fit";
import type { DocumentFitResult, FitCheckpoint, RestartOutcome } from "@/lib/tb/analysis/fit-document";

/** Lifecycle of a fit run. queued → running → one of the final states; a crashed worker's run goes back to queued. */
export const FIT_STATUSES = ["queued", "running", "converged", "not_converged", "cancelled", "failed"] as const;
export type FitStatus = (typeof FIT_STATUSES)[number];
export const FINAL_FIT_STATUSES: readonly FitStatus[] = ["converged", "not_converged", "cancelled", "failed"];
export const ACTIVE_FIT_STATUSES: readonly FitStatus[] = ["queued", "running"];

export const FIT_STATUS_LABEL: Record<FitStatus, string> = {
  queued: "waiting for a worker",
  running: "running",
  converged: "converged",
  not_converged: "not converged",
  cancelled: "cancelled",
  failed: "failed",
};

/** A checkpoint as stored with the heartbeat; it is resumed only by the engine version that wrote it. */
export type StoredCheckpoint = FitCheckpoint & { engineVersion: string };

/** A worker stopped (handed the run back) or crashed while running the fit; the next attempt resumed from here. */
export interface FitInterruption {
  at: string;
  by: "stop" | "crash";
  /** Iteration and lowest cost of the checkpoint the next attempt starts from (0 and null: from the beginning). */
  iteration: number;
  cost: number | null;
}

/** One point of the cost history: iteration, ½Σw·ΔE² (eV²), elapsed ms. */
export type CostPoint = [number, number, number];

/** The outcome stored in the fit record (JSON); the fitted document itself is the revision it produced. */
export interface FitOutcome extends Omit<FitResult, "statistics"> {
  residualVariance: number;
  standardErrors: number[] | null;
  correlations: number[][] | null;
  starts: RestartOutcome[];
}

export function outcomeOf(result: DocumentFitResult): FitOutcome {
  return {
    status: result.status,
    reason: result.reason,
    names: result.names,
    start: result.start,
    values: result.values,
    iterations: result.iterations,
    cost: result.cost,
    shift: result.shift,
    points: result.points,
    startRms: result.startRms,
    rms: result.rms,
    maxAbs: result.maxAbs,
    perBand: result.perBand,
    residualVariance: result.statistics.residualVariance,
    standardErrors: result.statistics.standardErrors,
    correlations: result.statistics.correlations,
    starts: result.starts,
    elapsedMs: result.elapsedMs,
  };
}

export function statusOfOutcome(outcome: FitOutcome): FitStatus {
  return outcome.status === "converged" ? "converged" : outcome.status === "cancelled" ? "cancelled" : "not_converged";
}

/** The note of the revision a fit produces: what was fitted, to what, and how well. */
export function fitRevisionNote(outcome: FitOutcome, referenceName: string, fitId: string): string {
  const meV = (x: number) => `${(x * 1000).toFixed(1)} meV`;
  const how = outcome.status === "converged" ? `converged in ${outcome.iterations} iterations` : `${outcome.status} after ${outcome.iterations} iterations (best point)`;
  return `Refit of ${outcome.names.length} parameter${outcome.names.length === 1 ? "" : "s"} to "${referenceName}": RMS ${meV(outcome.rms)}, max ${meV(outcome.maxAbs)}, ${how} (fit ${fitId.slice(0, 8)})`;
}

/** Cost history kept in the record: every accepted iteration up to this many, then every n-th (the last is always kept). */
export const COST_HISTORY_LIMIT = 2000;

export function appendCost(history: CostPoint[], point: CostPoint): CostPoint[] {
  if (history.length < COST_HISTORY_LIMIT) return [...history, point];
  const thinned = history.filter((_, i) => i % 2 === 0);
  return [...thinned, point];
}

/** A fit that ran at least this long is worth an e-mail (nobody watches a progress bar that long); failures always are. */
export const MAIL_FITS_AFTER_MS = 60_000;

export function shouldMailFit(status: FitStatus, elapsedMs: number): boolean {
  return status === "failed" || (status !== "cancelled" && elapsedMs >= MAIL_FITS_AFTER_MS);
}

/**
 * Fitted parameters the reference did not pin down: no uncertainty could be estimated, or it is larger than the
 * value itself and than 1 eV (a tight-binding parameter known to worse than that is not known at all).
 */
export function undeterminedNames(outcome: FitOutcome): string[] {
  const se = outcome.standardErrors;
  if (!se) return outcome.names;
  return outcome.names.filter((_, i) => !Number.isFinite(se[i]) || se[i] > Math.max(1, Math.abs(outcome.values[i])));
}
