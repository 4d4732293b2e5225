import { availableParallelism } from "node:os";
import PgBoss from "pg-boss";
import { lt } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { apiRateWindows, signInCounters } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { deliverWebhook } from "./deliver-webhook";
import { fanOutReleaseEvent } from "./fan-out";
import { failFit } from "@/lib/fits/worker-side";
import { ensureQueues, FIT_JOB_RETURNS, JOB_SCHEMA, QUEUES, WORKER_APPLICATION_NAME, type FitRunJob, type PasswordResetMailJob, type RegistryMailJob, type ReleaseEventJob, type WebhookDeliveryJob } from "./queues";
import { runFitJob } from "./run-fit";
import { giveBackStalledFits } from "./stalled-fits";
import { requeueUnsentReleaseEvents } from "./unsent-release-events";
import { sendRegistryMail } from "./send-registry-mail";
import { RESET_MAIL_BATCH, sendPasswordResetMails } from "./send-reset-mail";
import { jobSettings } from "./settings";

/**
 * The background worker: takes refits, release events, webhook deliveries and registry e-mail from the pg-boss queue
 * in the same PostgreSQL. Run as many as needed, on as many machines as share the database; pg-boss hands each job
 * to one of them. Each process runs up to FIT_CONCURRENCY refits at once, each in its own thread.
 * Start: node_modules/.bin/tsx --conditions=react-server lib/jobs/worker-main.ts
 */
// The queue's schema is installed and upgraded by the migration step (as the owner role), never by a worker.
// Its sessions are named so an operator (and the fault tests) can see which workers are connected.
const boss = new PgBoss({ connectionString: serverEnv().DATABASE_URL, schema: JOB_SCHEMA, migrate: false, max: 4, application_name: WORKER_APPLICATION_NAME });
boss.on("error", (err) => console.error("[bandgate worker]", err.message));
await boss.start();
await ensureQueues(boss);

const polling = { pollingIntervalSeconds: jobSettings().JOBS_POLL_SECONDS };

await boss.work<ReleaseEventJob>(QUEUES.releaseEvent, polling, async ([job]) => fanOutReleaseEvent(boss, job.data.eventId));
await boss.work<WebhookDeliveryJob>(QUEUES.webhookDelivery, { ...polling, batchSize: 1, includeMetadata: true }, async ([job]) =>
  deliverWebhook(job.data.deliveryId, job.retryCount >= job.retryLimit),
);
await boss.work<RegistryMailJob>(QUEUES.registryMail, polling, async ([job]) => sendRegistryMail(job.data.eventId, job.data.userId));
await boss.work<PasswordResetMailJob>(QUEUES.passwordResetMail, { ...polling, batchSize: RESET_MAIL_BATCH, includeMetadata: true }, async (jobs) =>
  sendPasswordResetMails(boss, jobs),
);
await boss.work(QUEUES.rateWindowCleanup, async () => {
  const hourAgo = new Date(Date.now() - 60 * 60 * 1000);
  await db.delete(apiRateWindows).where(lt(apiRateWindows.windowStart, hourAgo));
  await db.delete(signInCounters).where(lt(signInCounters.windowStart, hourAgo));
});
await boss.schedule(QUEUES.rateWindowCleanup, "17 * * * *");

const shutdown = new AbortController();
const fitSlots = jobSettings().FIT_CONCURRENCY ?? availableParallelism();
for (let i = 0; i < fitSlots; i++) {
  await boss.work<FitRunJob>(QUEUES.fitRun, { ...polling, batchSize: 1 }, async ([job]) =>
    runFitJob({
      fitId: job.data.fitId,
      shutdown: shutdown.signal,
      // Failing the job returns it to the queue; the run's own crash count is what the retry limit is checked against.
      giveBack: async () => void (await boss.fail(QUEUES.fitRun, job.id, { reason: "handed back: the worker was stopping" })),
    }),
  );
}
await boss.work<FitRunJob>(QUEUES.fitRunDead, polling, async ([job]) =>
  failFit(job.data.fitId, `the job came back to the queue more than ${FIT_JOB_RETURNS} times; no retries left`),
);
const { FIT_STALL_SECONDS, FIT_RETRY_LIMIT } = jobSettings();
const sweeper = setInterval(() => {
  giveBackStalledFits(boss, FIT_STALL_SECONDS * 1000, FIT_RETRY_LIMIT).catch((err) =>
    console.error("[bandgate worker] stalled-fit sweep failed", err instanceof Error ? err.message : err),
  );
}, Math.min(15_000, (FIT_STALL_SECONDS * 1000) / 4));
const resender = setInterval(() => {
  requeueUnsentReleaseEvents(boss)
    .then((ids) => ids.length && console.log(`[bandgate worker] re-queued ${ids.length} release event(s) that were never fanned out`))
    .catch((err) => console.error("[bandgate worker] release-event sweep failed", err instanceof Error ? err.message : err));
}, 60_000);
console.log(`[bandgate worker] taking jobs (${fitSlots} refit slots)`);

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  clearInterval(sweeper);
  clearInterval(resender);
  shutdown.abort();
  await boss.stop({ graceful: true, timeout: 10_000, wait: true });
  await closeDb();
  process.exit(0);
}
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
