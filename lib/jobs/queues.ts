import type PgBoss from "pg-boss";
import { jobSettings } from "./settings";

/** The queue's own schema, created and upgraded by the migration step as the owner role. */
export const JOB_SCHEMA = "pgboss";
/** application_name of a worker's queue sessions (pg_stat_activity). */
export const WORKER_APPLICATION_NAME = "bandgate-worker";

/**
 * Queue names. pg-boss 10 needs a queue (a table of its own) before its first job: the migration step creates them as
 * the owner role; every process checks for them on start, which changes nothing once they exist.
 */
export const QUEUES = {
  releaseEvent: "release-event",
  webhookDelivery: "webhook-delivery",
  registryMail: "registry-mail",
  passwordResetMail: "password-reset-mail",
  rateWindowCleanup: "rate-window-cleanup",
  fitRun: "fit-run",
  /** Fit jobs that came back to the queue too often (FIT_JOB_RETURNS) land here and are marked failed. */
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
  await boss.createQueue(QUEUES.webhookDelivery, { name: QUEUES.webhookDelivery, retryLimit: s.WEBHOOK_RETRY_LIMIT, retryDelay: s.WEBHOOK_RETRY_DELAY_SECONDS, retryBackoff: true, expireInSeconds: webhookJobExpiry() });
  await boss.createQueue(QUEUES.registryMail, { name: QUEUES.registryMail, retryLimit: 5, retryDelay: 30, retryBackoff: true });
  await boss.createQueue(QUEUES.passwordResetMail, { name: QUEUES.passwordResetMail, retryLimit: 3, retryDelay: 10, retryBackoff: true });
  await boss.createQueue(QUEUES.rateWindowCleanup, { name: QUEUES.rateWindowCleanup, policy: "singleton" });
  await boss.createQueue(QUEUES.fitRunDead, { name: QUEUES.fitRunDead, retryLimit: 3, retryDelay: 5 });
  await boss.createQueue(QUEUES.fitRun, { name: QUEUES.fitRun, deadLetter: QUEUES.fitRunDead, ...fitJobLimits() });
}

/** Retry options sent with each webhook job, so a changed setting applies without recreating the queue. */
export function webhookJobOptions(deliveryId: string): PgBoss.SendOptions {
  const s = jobSettings();
  return { id: deliveryId, retryLimit: s.WEBHOOK_RETRY_LIMIT, retryDelay: s.WEBHOOK_RETRY_DELAY_SECONDS, retryBackoff: true, expireInSeconds: webhookJobExpiry() };
}

/**
 * One delivery attempt lasts at most the call's timeout plus a few writes, so a job still active well after that
 * belonged to a worker that died mid-delivery: it expires and is retried (at least once; the receiver sees the same
 * Bandgate-Delivery id) instead of waiting pg-boss's default quarter of an hour.
 */
export function webhookJobExpiry(): number {
  return Math.ceil(jobSettings().WEBHOOK_TIMEOUT_MS / 1000) + 30;
}

/**
 * pg-boss runs a fit job again after every graceful hand-back and every crash; which of them count is decided by the
 * run's own crash count (FIT_RETRY_LIMIT), so pg-boss's limit only stops a job that keeps coming back without end.
 */
export const FIT_JOB_RETURNS = 100;

/** Retries and expiry of a fit job: it expires a minute after the fit's own time limit, so only a dead worker's job expires. */
export function fitJobLimits(): { retryLimit: number; retryDelay: number; expireInSeconds: number } {
  const s = jobSettings();
  return { retryLimit: FIT_JOB_RETURNS, retryDelay: 2, expireInSeconds: s.FIT_TIME_LIMIT_SECONDS + 60 };
}
