import type PgBoss from "pg-boss";
import { takeStalledFits } from "@/lib/fits/worker-side";
import { QUEUES } from "./queues";

/** A running fit whose heartbeat is older than this belongs to a dead worker. */
export const FIT_STALL_MS = 60_000;

/**
 * Gives back the jobs of fits whose worker died: failing the pg-boss job makes pg-boss retry it on any worker,
 * or, with no retries left, move it to the dead-letter queue, whose handler marks the run failed.
 */
export async function giveBackStalledFits(boss: PgBoss, staleAfterMs = FIT_STALL_MS): Promise<number> {
  const stalled = await takeStalledFits(staleAfterMs);
  for (const run of stalled) {
    await boss.fail(QUEUES.fitRun, run.id, { reason: "the worker stopped responding" });
  }
  return stalled.length;
}
