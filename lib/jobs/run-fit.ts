import { buildFitProblem } from "@/lib/fits/problem";
import { FitThreadError, runFitInThread } from "@/lib/fits/fit-thread-client";
import { claimFit, crashedTooOften, handBackFit, releaseAfterCrash, writeProgress, type ProgressSnapshot } from "@/lib/fits/attempt";
import { appendCost, type FitOutcome, type StoredCheckpoint } from "@/lib/fits/record";
import { failFit, finishFit, loadRunContext } from "@/lib/fits/worker-side";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import { TB_ENGINE_VERSION } from "@/lib/tb/version";
import { jobSettings } from "./settings";

export interface FitJobAttempt {
  fitId: string;
  /** Raised when the worker process is shutting down: the fit is handed back for another worker to resume. */
  shutdown?: AbortSignal;
  /** Returns the job to the queue without a crash counted (after a graceful stop). */
  giveBack: () => Promise<void>;
}

export class FitAttemptFailed extends Error {}

/**
 * One attempt at a fit job. The fit runs in its own thread, from the run's last checkpoint when an earlier attempt was
 * stopped or crashed; this side writes progress and the checkpoint (the heartbeat, every FIT_PROGRESS_MS) and stops
 * the fit on a cancel request or at the time limit. At shutdown it hands the run back with its checkpoint, which
 * costs no retry. Bad input fails the run at once; a crashed thread counts a crash and throws FitAttemptFailed so
 * pg-boss runs the job again, until the run has crashed more than FIT_RETRY_LIMIT times.
 */
export async function runFitJob(attempt: FitJobAttempt): Promise<void> {
  const settings = jobSettings();
  const run = await claimFit(attempt.fitId, settings.FIT_RETRY_LIMIT);
  if (!run) return;
  let problem, ctx;
  try {
    ctx = await loadRunContext(run);
    problem = buildFitProblem(ctx.document, ctx.parsedReference, run.spec);
  } catch (err) {
    return failFit(run.id, `the refit could not be set up: ${err instanceof Error ? err.message : String(err)}`);
  }

  // A checkpoint is resumed only by the engine that wrote it; another engine starts afresh.
  const resume = run.checkpoint?.engineVersion === TB_ENGINE_VERSION ? run.checkpoint : null;
  const t0 = Date.now();
  const elapsed = () => (resume?.elapsedMs ?? 0) + Date.now() - t0;
  const progress: ProgressSnapshot = {
    iteration: resume?.iteration ?? 0,
    cost: resume?.cost ?? null,
    elapsedMs: elapsed(),
    history: resume ? run.costHistory.filter(([iteration]) => iteration <= resume.iteration) : [],
    checkpoint: resume,
  };
  let stopReason: "cancel" | "time" | "shutdown" | "lost" | null = null;
  const thread = runFitInThread(
    { type: "run", doc: ctx.document, keys: problem.keys, reference: problem.reference, options: { ...problem.options, resume: resume ?? undefined } },
    (p) => {
      progress.checkpoint = { ...p.checkpoint, engineVersion: TB_ENGINE_VERSION } satisfies StoredCheckpoint;
      progress.iteration = p.iteration;
      progress.cost = p.checkpoint.cost;
      progress.history = appendCost(progress.history, [p.iteration, p.cost, p.elapsedMs]);
    },
  );
  const stop = (why: NonNullable<typeof stopReason>) => {
    if (stopReason) return;
    stopReason = why;
    // At shutdown the thread is ended at once: the last checkpoint is where the next attempt resumes.
    if (why === "shutdown") void thread.terminate();
    else thread.stop();
  };
  const onShutdown = () => stop("shutdown");
  attempt.shutdown?.addEventListener("abort", onShutdown);
  if (attempt.shutdown?.aborted) onShutdown();
  let writing = false;
  const beat = setInterval(async () => {
    if (writing || stopReason === "shutdown") return;
    writing = true;
    try {
      const answer = await writeProgress(run, { ...progress, elapsedMs: elapsed() });
      if (answer.cancel) stop("cancel");
      if (answer.lost) stop("lost");
    } catch (err) {
      console.error("[bandgate worker] progress write failed", run.id, err instanceof Error ? err.message : err);
    } finally {
      writing = false;
    }
    if (elapsed() > settings.FIT_TIME_LIMIT_SECONDS * 1000) stop("time");
  }, settings.FIT_PROGRESS_MS);

  try {
    let outcome: FitOutcome = await thread.result;
    if (stopReason === "lost") return;
    if (stopReason === "time" && outcome.status === "cancelled") {
      outcome = { ...outcome, status: "not converged", reason: `time limit of ${settings.FIT_TIME_LIMIT_SECONDS} s reached` };
    }
    await finishFit(run, ctx, outcome, progress.history);
  } catch (err) {
    if (stopReason === "shutdown") {
      if (await handBackFit(run, { ...progress, elapsedMs: elapsed() })) await attempt.giveBack();
      return;
    }
    if (stopReason === "lost") return;
    const message = err instanceof Error ? err.message : String(err);
    if (err instanceof FitInputError || (err instanceof FitThreadError && err.inputError)) return failFit(run.id, message.replace(/^fit: /, ""));
    const reason = `attempt ${run.attempts} failed: ${message}`;
    const crashes = await releaseAfterCrash(run, reason);
    if (crashes !== null && crashes > settings.FIT_RETRY_LIMIT) return failFit(run.id, crashedTooOften(crashes, settings.FIT_RETRY_LIMIT, reason));
    throw new FitAttemptFailed(message);
  } finally {
    clearInterval(beat);
    attempt.shutdown?.removeEventListener("abort", onShutdown);
    await thread.terminate();
  }
}
