import { and, isNull, lt } from "drizzle-orm";
import type PgBoss from "pg-boss";
import { db } from "@/db/client";
import { releaseEvents } from "@/db/schema";
import { QUEUES, type ReleaseEventJob } from "./queues";

/** An event not fanned out this long after its release is treated as lost (the fan-out itself takes seconds). */
export const UNSENT_AFTER_MS = 2 * 60_000;

/**
 * A release commits before its event is queued, so a queue that was unreachable at that moment (or a job that used
 * up its retries) leaves subscribers untold. This finds such events and queues them again; the fan-out is
 * idempotent, so an event whose job is merely slow is at worst fanned out twice without anyone hearing twice.
 * Returns the events re-queued.
 */
export async function requeueUnsentReleaseEvents(boss: PgBoss, olderThanMs = UNSENT_AFTER_MS): Promise<string[]> {
  const stale = await db
    .select({ id: releaseEvents.id })
    .from(releaseEvents)
    .where(and(isNull(releaseEvents.fannedOutAt), lt(releaseEvents.createdAt, new Date(Date.now() - olderThanMs))))
    .limit(100);
  const requeued: string[] = [];
  for (const { id } of stale) {
    const job = await boss.getJobById<ReleaseEventJob>(QUEUES.releaseEvent, id);
    if (job && (job.state === "created" || job.state === "retry" || job.state === "active")) continue;
    await boss.send(QUEUES.releaseEvent, { eventId: id } satisfies ReleaseEventJob, { singletonKey: `resend:${id}` });
    requeued.push(id);
  }
  return requeued;
}
