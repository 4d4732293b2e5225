import "server-only";
import PgBoss from "pg-boss";
import { serverEnv } from "@/lib/env";
import { ensureQueues, fitJobLimits, JOB_SCHEMA, QUEUES, type FitRunJob, type PasswordResetMailJob, type ReleaseEventJob } from "./queues";

const cache = globalThis as unknown as { bandgateBoss?: Promise<PgBoss> };

/**
 * A pg-boss instance for sending from the web process (no maintenance or schedules: the worker does those). The app
 * role may not change the queue's schema, so it checks the installed version instead of migrating it.
 */
export function jobQueue(): Promise<PgBoss> {
  cache.bandgateBoss ??= (async () => {
    const boss = new PgBoss({ connectionString: serverEnv().DATABASE_URL, schema: JOB_SCHEMA, migrate: false, max: 2, supervise: false, schedule: false });
    boss.on("error", (err) => console.error("[bandgate] job queue", err.message));
    await boss.start();
    await ensureQueues(boss);
    return boss;
  })().catch((err) => {
    cache.bandgateBoss = undefined;
    throw err;
  });
  return cache.bandgateBoss;
}

/**
 * Hands a committed release event to the worker. The release itself is already committed, so a queue failure must not
 * undo it: it is logged, and the event row stays as the record of what subscribers were not told.
 */
export async function enqueueReleaseEvent(eventId: string): Promise<void> {
  try {
    const boss = await jobQueue();
    await boss.send(QUEUES.releaseEvent, { eventId } satisfies ReleaseEventJob, { id: eventId });
  } catch (err) {
    console.error("[bandgate] could not enqueue release event", eventId, err instanceof Error ? err.message : err);
  }
}

/** Hands a committed fit run to a worker; the job id is the fit id, so a repeated send is a no-op. */
export async function enqueueFit(fitId: string): Promise<void> {
  const boss = await jobQueue();
  await boss.send(QUEUES.fitRun, { fitId } satisfies FitRunJob, { id: fitId, ...fitJobLimits() });
}

/** Hands a password-reset request to the worker, which decides whether anything is mailed. */
export async function enqueuePasswordResetMail(job: PasswordResetMailJob): Promise<void> {
  const boss = await jobQueue();
  await boss.send(QUEUES.passwordResetMail, job);
}

/** Stops the sending instance (scripts and tests that exit). */
export async function stopJobQueue(): Promise<void> {
  const pending = cache.bandgateBoss;
  cache.bandgateBoss = undefined;
  if (pending) await (await pending).stop({ graceful: false, wait: true });
}
