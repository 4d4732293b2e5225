import type PgBoss from "pg-boss";
import { crashedTooOften, takeStalledFits } from "@/lib/fits/attempt";
import { failFit } from "@/lib/fits/worker-side";
import { QUEUES } from "./queues";

/**
 * Gives back the jobs of fits whose worker died (no heartbeat for `staleAfterMs`): each counts a crash. Failing the
 * pg-boss job makes pg-boss run it again on any worker, which resumes from the run's last checkpoint; a run that has
 * crashed more than `crashLimit` times is marked failed and its job cancelled.
 */
export async function giveBackStalledFits(boss: PgBoss, staleAfterMs: number, crashLimit: number): Promise<number> {
  const stalled = await takeStalledFits(staleAfterMs);
  for (const run of stalled) {
    if (run.crashes > crashLimit) {
      await failFit(run.id, crashedTooOften(run.crashes, crashLimit, run.failureReason));
      await boss.cancel(QUEUES.fitRun, run.id);
    } else {
      await boss.fail(QUEUES.fitRun, run.id, { reason: "the worker stopped responding" });
    }
  }
  return stalled.length;
}
