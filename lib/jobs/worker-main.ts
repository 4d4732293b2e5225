import PgBoss from "pg-boss";
import { lt } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { apiRateWindows } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { deliverWebhook } from "./deliver-webhook";
import { fanOutReleaseEvent } from "./fan-out";
import { ensureQueues, QUEUES, type RegistryMailJob, type ReleaseEventJob, type WebhookDeliveryJob } from "./queues";
import { sendRegistryMail } from "./send-registry-mail";
import { jobSettings } from "./settings";

/**
 * The background worker: takes release events, webhook deliveries and registry e-mail from the pg-boss queue in the
 * same PostgreSQL. Run as many as needed; pg-boss hands each job to one of them.
 * Start: node_modules/.bin/tsx --conditions=react-server lib/jobs/worker-main.ts
 */
const boss = new PgBoss({ connectionString: serverEnv().DATABASE_URL, max: 4 });
boss.on("error", (err) => console.error("[bandgate worker]", err.message));
await boss.start();
await ensureQueues(boss);

const polling = { pollingIntervalSeconds: jobSettings().JOBS_POLL_SECONDS };

await boss.work<ReleaseEventJob>(QUEUES.releaseEvent, polling, async ([job]) => fanOutReleaseEvent(boss, job.data.eventId));
await boss.work<WebhookDeliveryJob>(QUEUES.webhookDelivery, { ...polling, batchSize: 1, includeMetadata: true }, async ([job]) =>
  deliverWebhook(job.data.deliveryId, job.retryCount >= job.retryLimit),
);
await boss.work<RegistryMailJob>(QUEUES.registryMail, polling, async ([job]) => sendRegistryMail(job.data.eventId, job.data.userId));
await boss.work(QUEUES.rateWindowCleanup, async () => {
  await db.delete(apiRateWindows).where(lt(apiRateWindows.windowStart, new Date(Date.now() - 60 * 60 * 1000)));
});
await boss.schedule(QUEUES.rateWindowCleanup, "17 * * * *");
console.log("[bandgate worker] taking jobs");

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  await boss.stop({ graceful: true, timeout: 10_000, wait: true });
  await closeDb();
  process.exit(0);
}
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
