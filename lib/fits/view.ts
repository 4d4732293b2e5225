import type { FitRunRow } from "./queries";
import { compareReproduction, type Reproduction } from "./reproduce";
import { describeFitWeights } from "./result-document";
import { ACTIVE_FIT_STATUSES, FIT_STATUS_LABEL, type CostPoint, type FitInterruption, type FitStatus } from "./record";

/** A fit run as the pages and the API show it (JSON-safe). */
export interface FitRunView {
  id: string;
  status: FitStatus;
  statusLabel: string;
  active: boolean;
  startedById: string;
  startedBy: string;
  referenceName: string;
  baseRevision: number;
  resultRevision: number | null;
  rerunOf: string | null;
  parameters: string[];
  iteration: number;
  maxIterations: number;
  cost: number | null;
  history: CostPoint[];
  elapsedMs: number;
  attempts: number;
  /** Attempts that ended in a crash (only these count against the retry limit). */
  crashes: number;
  /** Each worker stop or crash during the run, and the iteration it resumed from. */
  interruptions: FitInterruption[];
  /** The interruptions in a sentence, null when the run went in one go. */
  resumed: string | null;
  /** Milliseconds since the worker last wrote progress (null before it started). */
  heartbeatAgeMs: number | null;
  cancelRequested: boolean;
  /** RMS at the start values over the same points (absent on records made before it was kept). */
  startRms: number | null;
  rms: number | null;
  maxAbs: number | null;
  reason: string | null;
  applyNote: string | null;
  failureReason: string | null;
  createdAt: string;
  finishedAt: string | null;
  engineVersion: string;
  /** Settings in a line: alignment, window, offset, weights, starts and seed, to tell runs apart. */
  settings: string;
  /** For a re-run whose original is known: whether it reproduced the original's values exactly. */
  reproduced: Reproduction | null;
}

function settingsLine(spec: FitRunRow["run"]["spec"]): string {
  const window = spec.window ? `window ${spec.window[0]} to ${spec.window[1]} eV` : "every energy";
  const starts = spec.restarts ? `${spec.restarts} extra start${spec.restarts === 1 ? "" : "s"}, seed ${spec.seed}` : `seed ${spec.seed}`;
  return `${describeFitWeights(spec)}; ${window}; ${starts}`;
}

/** "Resumed twice from its best point so far: after a crash at iteration 12, after a worker stop at iteration 20." */
export function describeResumes(interruptions: FitInterruption[]): string | null {
  if (interruptions.length === 0) return null;
  const times = interruptions.length === 1 ? "once" : interruptions.length === 2 ? "twice" : `${interruptions.length} times`;
  const each = interruptions.map(
    (i) => `after ${i.by === "stop" ? "a worker stop" : "a crash"} ${i.cost === null ? "before its first step (from the start)" : `at iteration ${i.iteration}`}`,
  );
  return `Resumed ${times} from its best point so far: ${each.join(", ")}.`;
}

export function fitRunView(row: FitRunRow, now = Date.now(), original?: FitRunRow["run"] | null): FitRunView {
  const { run } = row;
  return {
    id: run.id,
    status: run.status,
    statusLabel: FIT_STATUS_LABEL[run.status],
    active: ACTIVE_FIT_STATUSES.includes(run.status),
    startedById: run.startedBy,
    startedBy: row.startedByName,
    referenceName: row.referenceName,
    baseRevision: row.baseRevisionNumber,
    resultRevision: row.resultRevisionNumber,
    rerunOf: run.rerunOf,
    parameters: run.spec.parameters.map((p) => p.key),
    iteration: run.iteration,
    maxIterations: run.spec.maxIterations * (run.spec.restarts + 1),
    cost: run.cost,
    history: run.costHistory,
    elapsedMs: run.elapsedMs,
    attempts: run.attempts,
    crashes: run.crashes,
    interruptions: run.interruptions,
    resumed: describeResumes(run.interruptions),
    heartbeatAgeMs: run.progressAt ? Math.max(0, now - run.progressAt.getTime()) : null,
    cancelRequested: Boolean(run.cancelRequestedAt),
    startRms: run.outcome?.startRms ?? null,
    rms: run.outcome?.rms ?? null,
    maxAbs: run.outcome?.maxAbs ?? null,
    reason: run.outcome?.reason ?? null,
    applyNote: run.applyNote,
    failureReason: run.failureReason,
    createdAt: run.createdAt.toISOString(),
    finishedAt: run.finishedAt?.toISOString() ?? null,
    engineVersion: run.engineVersion,
    settings: settingsLine(run.spec),
    reproduced: original?.outcome && run.outcome ? compareReproduction(original.outcome, run.outcome, original.engineVersion === run.engineVersion) : null,
  };
}
