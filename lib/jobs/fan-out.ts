import "server-only";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type PgBoss from "pg-boss";
import { db } from "@/db/client";
import { familySubscriptions, releaseEvents, users, webhookDeliveries, webhookSubscriptions } from "@/db/schema";
import { webhookBody } from "@/lib/registry/webhook-payload";
import { loadEventContext } from "./event-context";
import { QUEUES, webhookJobOptions, type RegistryMailJob } from "./queues";

/** A stable job id per (event, recipient), so a re-run of the fan-out never mails anyone twice. */
function mailJobId(eventId: string, userId: string): string {
  const h = createHash("sha256").update(`${eventId}/${userId}`).digest("hex");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

/**
 * One release event → one signed delivery per active webhook subscription of the family and one e-mail per
 * subscriber, each its own job; subscriptions and follows of deactivated accounts get nothing. Idempotent:
 * deliveries are unique per (event, subscription) and jobs carry fixed ids.
 * Marks the event fanned out at the end, so a sweep can tell events whose job was never queued or was lost.
 */
export async function fanOutReleaseEvent(boss: PgBoss, eventId: string): Promise<void> {
  const ctx = await loadEventContext(eventId);
  if (!ctx) return;
  const body = webhookBody({
    kind: ctx.kind,
    eventId: ctx.eventId,
    occurredAt: ctx.occurredAt,
    family: { slug: ctx.familySlug, title: ctx.familyTitle },
    release: { version: ctx.version, sha256: ctx.sha256, releasedAt: ctx.releasedAt, deprecationReason: ctx.deprecationReason, successorVersion: ctx.successorVersion, withdrawalReason: ctx.withdrawalReason },
    appUrl: ctx.appUrl,
  });
  const subs = await db
    .select({ id: webhookSubscriptions.id })
    .from(webhookSubscriptions)
    .innerJoin(users, eq(users.id, webhookSubscriptions.userId))
    .where(and(eq(webhookSubscriptions.familyId, ctx.familyId), eq(webhookSubscriptions.active, true), eq(users.active, true)));
  if (subs.length) {
    await db.insert(webhookDeliveries).values(subs.map((s) => ({ eventId, subscriptionId: s.id, body }))).onConflictDoNothing();
  }
  const pending = await db
    .select({ id: webhookDeliveries.id })
    .from(webhookDeliveries)
    .where(and(eq(webhookDeliveries.eventId, eventId), eq(webhookDeliveries.status, "pending"), eq(webhookDeliveries.attempts, 0)));
  for (const d of pending) await boss.send(QUEUES.webhookDelivery, { deliveryId: d.id }, webhookJobOptions(d.id));

  const readers = await db
    .select({ userId: users.id })
    .from(familySubscriptions)
    .innerJoin(users, eq(users.id, familySubscriptions.userId))
    .where(and(eq(familySubscriptions.familyId, ctx.familyId), eq(users.active, true)));
  for (const r of readers) {
    await boss.send(QUEUES.registryMail, { eventId, userId: r.userId } satisfies RegistryMailJob, { id: mailJobId(eventId, r.userId) });
  }
  await db.update(releaseEvents).set({ fannedOutAt: new Date() }).where(eq(releaseEvents.id, eventId));
}
