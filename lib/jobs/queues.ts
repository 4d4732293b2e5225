import type PgBoss from "pg-boss";
import { jobSettings } from "./settings";

/** Queue names; every process creates them on start (pg-boss 10 needs a queue before its first job). */
export const QUEUES = {
  releaseEvent: "release-event",
  webhookDelivery: "webhook-delivery",
  registryMail: "registry-mail",
  passwordResetMail: "password-reset-mail",
  rateWindowCleanup: "rate-window-cleanup",
  fitRun: "fit-run",
  /** Fit jobs that used up their retries (a worker died each time) land here and are marked failed. */
  fitRunDead: "fit-run-dead",
} as const;

export interface FitRunJob {
  fitId: string;
}

export interface ReleaseEventJob {
  eventId: string;
}
export interface WebhookDeliveryJob {
  deliveryId: string;
}
/** A password-reset request as the web process took it; the worker looks the address up. */
export interface PasswordResetMailJob {
  email: string;
  /** The client address (lib/auth/client-ip.ts); null when unknown: then only the per-account cap applies. */
  requestedIp: string | null;
}

export interface RegistryMailJob {
  eventId: string;
  userId: string;
}

export async function ensureQueues(boss: PgBoss): Promise<void> {
  const s = jobSettings();
  await boss.createQueue(QUEUES.releaseEvent, { name: QUEUES.releaseEvent, retryLimit: 5, retryDelay: 5, retryBackoff: true });
  await boss.createQueue(QUEUES.webhookDelivery, { name: QUEUES.webhookDelivery, retryLimit: s.WEBHOOK_RETRY_LIMIT, retryDelay: s.WEBHOOK_RETRY_DELAY_SECONDS, retryBackoff: true });
  await boss.createQueue(QUEUES.registryMail, { name: QUEUES.registryMail, retryLimit: 5, retryDelay: 30, retryBackoff: true });
  await boss.createQueue(QUEUES.passwordResetMail, { name: QUEUES.passwordResetMail, retryLimit: 3, retryDelay: 10, retryBackoff: true });
  await boss.createQueue(QUEUES.rateWindowCleanup, { name: QUEUES.rateWindowCleanup, policy: "singleton" });
  await boss.createQueue(QUEUES.fitRunDead, { name: QUEUES.fitRunDead, retryLimit: 3, retryDelay: 5 });
  await boss.createQueue(QUEUES.fitRun, { name: QUEUES.fitRun, deadLetter: QUEUES.fitRunDead, ...fitJobLimits() });
}

/** Retry options sent with each webhook job, so a changed setting applies without recreating the queue. */
export function webhookJobOptions(deliveryId: string): PgBoss.SendOptions {
  const s = jobSettings();
  return { id: deliveryId, retryLimit: s.WEBHOOK_RETRY_LIMIT, retryDelay: s.WEBHOOK_RETRY_DELAY_SECONDS, retryBackoff: true };
}

/** Retries and expiry of a fit job: it expires a minute after the fit's own time limit, so only a dead worker's job expires. */
export function fitJobLimits(): { retryLimit: number; retryDelay: number; expireInSeconds: number } {
  const s = jobSettings();
  return { retryLimit: s.FIT_RETRY_LIMIT, retryDelay: 2, expireInSeconds: s.FIT_TIME_LIMIT_SECONDS + 60 };
}
