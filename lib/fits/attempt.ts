import "server-only";
import { and, eq, inArray, lt, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { fitRuns, type FitRun } from "@/db/schema";
import type { CostPoint, FitInterruption, StoredCheckpoint } from "./record";
import { failFit } from "./worker-side";

/* One attempt at a fit run in a worker: claim, heartbeat with checkpoint, hand back on a graceful stop, count a crash.
   Only crashes count against the retry limit; a graceful stop hands the run back to resume from its checkpoint. */

/** Appends an interruption built from the checkpoint stored at the last heartbeat (the next attempt resumes there). */
const interruptedAtCheckpoint = (by: FitInterruption["by"]) =>
  sql`${fitRuns.interruptions} || jsonb_build_array(jsonb_build_object('at', now(), 'by', ${by}::text,
    'iteration', coalesce((${fitRuns.checkpoint}->>'iteration')::int, 0), 'cost', ${fitRuns.checkpoint}->'cost'))`;

/**
 * Marks a waiting run as running (one more attempt); null when there is nothing to do (finished or cancelled). A run
 * still marked running was held by an attempt that ended without handing it back or being noticed as stalled (its job
 * expired, or its worker failed unexpectedly): that counts as a crash, and a run past `crashLimit` crashes fails.
 */
export async function claimFit(fitId: string, crashLimit = Infinity): Promise<FitRun | null> {
  const orphaned = sql`${fitRuns.status} = 'running'`;
  const [run] = await db
    .update(fitRuns)
    .set({
      status: "running",
      attempts: sql`${fitRuns.attempts} + 1`,
      crashes: sql`${fitRuns.crashes} + (${orphaned})::int`,
      interruptions: sql`case when ${orphaned} then ${interruptedAtCheckpoint("crash")} else ${fitRuns.interruptions} end`,
      failureReason: sql`case when ${orphaned} then 'attempt ' || ${fitRuns.attempts} || ' ended without finishing or handing the run back' else ${fitRuns.failureReason} end`,
      startedAt: sql`coalesce(${fitRuns.startedAt}, now())`,
      progressAt: new Date(),
    })
    .where(and(eq(fitRuns.id, fitId), inArray(fitRuns.status, ["queued", "running"])))
    .returning();
  if (!run) return null;
  if (run.crashes > crashLimit) {
    await failFit(fitId, crashedTooOften(run.crashes, crashLimit, run.failureReason));
    return null;
  }
  if (run.cancelRequestedAt) {
    await db.update(fitRuns).set({ status: "cancelled", finishedAt: new Date() }).where(eq(fitRuns.id, fitId));
    return null;
  }
  return run;
}

export function crashedTooOften(crashes: number, limit: number, last: string | null): string {
  return `crashed ${crashes} time${crashes === 1 ? "" : "s"}, more than the ${limit} allowed; no retries left${last ? ` (last: ${last})` : ""}`;
}

export interface ProgressSnapshot {
  iteration: number;
  cost: number | null;
  elapsedMs: number;
  history: CostPoint[];
  checkpoint: StoredCheckpoint | null;
}

/** Only the attempt that claimed the run may write to it: a stalled attempt that wakes up finds it taken. */
const heldBy = (run: FitRun) => and(eq(fitRuns.id, run.id), eq(fitRuns.status, "running"), eq(fitRuns.attempts, run.attempts));

const progressColumns = (p: ProgressSnapshot) => ({
  iteration: p.iteration,
  cost: p.cost,
  elapsedMs: Math.round(p.elapsedMs),
  costHistory: p.history,
  checkpoint: p.checkpoint,
  progressAt: new Date(),
});

/** The heartbeat: progress and checkpoint so far; answers whether someone asked to cancel, or the run is no longer this attempt's. */
export async function writeProgress(run: FitRun, p: ProgressSnapshot): Promise<{ cancel: boolean; lost: boolean }> {
  const [row] = await db.update(fitRuns).set(progressColumns(p)).where(heldBy(run)).returning({ cancelRequestedAt: fitRuns.cancelRequestedAt });
  return { cancel: Boolean(row?.cancelRequestedAt), lost: !row };
}

/**
 * A graceful stop: the run goes back to waiting with its latest checkpoint, for any worker to resume. Not a crash, so
 * it does not count against the retry limit. False when the run was no longer this attempt's.
 */
export async function handBackFit(run: FitRun, p: ProgressSnapshot): Promise<boolean> {
  const entry: FitInterruption = { at: new Date().toISOString(), by: "stop", iteration: p.checkpoint?.iteration ?? 0, cost: p.checkpoint?.cost ?? null };
  const rows = await db
    .update(fitRuns)
    .set({ ...progressColumns(p), status: "queued", interruptions: sql`${fitRuns.interruptions} || ${JSON.stringify([entry])}::jsonb` })
    .where(heldBy(run))
    .returning({ id: fitRuns.id });
  return rows.length > 0;
}

/** A crashed attempt (its fit thread failed): one more crash, back to waiting to resume from the last heartbeat's checkpoint. */
export async function releaseAfterCrash(run: FitRun, reason: string): Promise<number | null> {
  const [row] = await db
    .update(fitRuns)
    .set({ status: "queued", crashes: sql`${fitRuns.crashes} + 1`, failureReason: reason, interruptions: interruptedAtCheckpoint("crash") })
    .where(heldBy(run))
    .returning({ crashes: fitRuns.crashes });
  return row?.crashes ?? null;
}

/**
 * Runs whose worker stopped writing its heartbeat (it died or lost the database) count a crash and go back to waiting;
 * the caller gives their pg-boss jobs back (or fails the runs that crashed too often).
 */
export async function takeStalledFits(staleAfterMs: number): Promise<{ id: string; crashes: number; failureReason: string | null }[]> {
  return db
    .update(fitRuns)
    .set({
      status: "queued",
      crashes: sql`${fitRuns.crashes} + 1`,
      interruptions: interruptedAtCheckpoint("crash"),
      failureReason: sql`'attempt ' || ${fitRuns.attempts} || ': the worker stopped responding (no progress since ' || to_char(${fitRuns.progressAt} at time zone 'UTC', 'HH24:MI:SS') || ' UTC)'`,
    })
    .where(and(eq(fitRuns.status, "running"), lt(fitRuns.progressAt, new Date(Date.now() - staleAfterMs))))
    .returning({ id: fitRuns.id, crashes: fitRuns.crashes, failureReason: fitRuns.failureReason });
}
