import { buildFitProblem } from "@/lib/fits/problem";
import { FitThreadError, runFitInThread } from "@/lib/fits/fit-thread-client";
import { appendCost, type CostPoint, type FitOutcome } from "@/lib/fits/record";
import { claimFit, failFit, finishFit, loadRunContext, releaseForRetry, writeProgress } from "@/lib/fits/worker-side";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import { jobSettings } from "./settings";

export interface FitJobAttempt {
  fitId: string;
  /** Retries used so far and allowed (from pg-boss). */
  retryCount: number;
  retryLimit: number;
  /** Raised when the worker process is shutting down: the fit stops and is given back for another worker. */
  shutdown?: AbortSignal;
}

export class FitAttemptFailed extends Error {}

/**
 * One attempt at a fit job. The fit runs in its own thread; this side writes progress (a heartbeat, every
 * FIT_PROGRESS_MS) and stops the fit on a cancel request, at the time limit or at shutdown. Bad input fails the run
 * at once; a crash throws FitAttemptFailed so pg-boss retries, and on the last attempt marks the run failed.
 */
export async function runFitJob(attempt: FitJobAttempt): Promise<void> {
  const settings = jobSettings();
  const run = await claimFit(attempt.fitId);
  if (!run) return;
  const lastAttempt = attempt.retryCount >= attempt.retryLimit;
  let problem, ctx;
  try {
    ctx = await loadRunContext(run);
    problem = buildFitProblem(ctx.document, ctx.parsedReference, run.spec);
  } catch (err) {
    return failFit(run.id, `the refit could not be set up: ${err instanceof Error ? err.message : String(err)}`);
  }

  const t0 = Date.now();
  let history: CostPoint[] = [];
  let latest: { iteration: number; cost: number | null } = { iteration: 0, cost: null };
  let stopReason: "cancel" | "time" | "shutdown" | "lost" | null = null;
  const thread = runFitInThread({ type: "run", doc: ctx.document, keys: problem.keys, reference: problem.reference, options: problem.options }, (p) => {
    latest = { iteration: p.iteration, cost: latest.cost === null ? p.cost : Math.min(latest.cost, p.cost) };
    history = appendCost(history, [p.iteration, p.cost, p.elapsedMs]);
  });
  const stop = (why: NonNullable<typeof stopReason>) => {
    if (stopReason) return;
    stopReason = why;
    thread.stop();
  };
  const onShutdown = () => stop("shutdown");
  attempt.shutdown?.addEventListener("abort", onShutdown);
  let writing = false;
  const beat = setInterval(async () => {
    if (writing) return;
    writing = true;
    try {
      const answer = await writeProgress(run.id, { ...latest, elapsedMs: Date.now() - t0, history });
      if (answer.cancel) stop("cancel");
      if (answer.lost) stop("lost");
    } catch (err) {
      console.error("[bandgate worker] progress write failed", run.id, err instanceof Error ? err.message : err);
    } finally {
      writing = false;
    }
    if (Date.now() - t0 > settings.FIT_TIME_LIMIT_SECONDS * 1000) stop("time");
  }, settings.FIT_PROGRESS_MS);

  try {
    let outcome: FitOutcome = await thread.result;
    if (stopReason === "shutdown") throw new FitThreadError("the worker was stopped; the refit starts again on a worker", false);
    if (stopReason === "lost") return;
    if (stopReason === "time" && outcome.status === "cancelled") {
      outcome = { ...outcome, status: "not converged", reason: `time limit of ${settings.FIT_TIME_LIMIT_SECONDS} s reached` };
    }
    await finishFit(run, ctx, outcome, history);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    if (err instanceof FitInputError || (err instanceof FitThreadError && err.inputError)) return failFit(run.id, message.replace(/^fit: /, ""));
    if (lastAttempt) return failFit(run.id, `attempt ${run.attempts} of ${attempt.retryLimit + 1} failed, no retries left: ${message}`);
    await releaseForRetry(run.id, `attempt ${run.attempts} failed: ${message}`);
    throw new FitAttemptFailed(message);
  } finally {
    clearInterval(beat);
    attempt.shutdown?.removeEventListener("abort", onShutdown);
    await thread.terminate();
  }
}
