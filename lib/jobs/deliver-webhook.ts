import "server-only";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users, webhookAttempts, webhookDeliveries, webhookSubscriptions } from "@/db/schema";
import { resolveHost } from "@/lib/registry/resolve-host";
import { SIGNATURE_HEADER, signWebhookBody } from "@/lib/registry/signing";
import type { Resolver } from "@/lib/registry/webhook-target";
import { postWebhook, type PostResult } from "./post-webhook";
import { jobSettings } from "./settings";

export class DeliveryFailed extends Error {}

function notSent(error: string): PostResult {
  return { statusCode: null, error, excerpt: null, ms: 0, final: true };
}

/**
 * One attempt of one webhook delivery: POST the stored body, signed, and log the attempt. A non-2xx answer or a
 * network error throws, so pg-boss retries it with backoff; after the last retry the delivery is marked failed.
 * Nothing is sent (and nothing retried) for a removed subscription, a deactivated subscriber or a refused address.
 * `resolve` is the name service the connection uses (tests give their own).
 */
export async function deliverWebhook(deliveryId: string, isLastTry: boolean, resolve: Resolver = resolveHost): Promise<void> {
  const [row] = await db
    .select({
      id: webhookDeliveries.id,
      body: webhookDeliveries.body,
      status: webhookDeliveries.status,
      url: webhookSubscriptions.url,
      secret: webhookSubscriptions.secret,
      active: webhookSubscriptions.active,
      ownerActive: users.active,
    })
    .from(webhookDeliveries)
    .innerJoin(webhookSubscriptions, eq(webhookSubscriptions.id, webhookDeliveries.subscriptionId))
    .innerJoin(users, eq(users.id, webhookSubscriptions.userId))
    .where(eq(webhookDeliveries.id, deliveryId));
  if (!row || row.status !== "pending") return;
  const event = (JSON.parse(row.body) as { event: string }).event;
  const [{ attempt }] = await db
    .update(webhookDeliveries)
    .set({ attempts: sql`${webhookDeliveries.attempts} + 1`, updatedAt: new Date() })
    .where(eq(webhookDeliveries.id, deliveryId))
    .returning({ attempt: webhookDeliveries.attempts });
  const settings = jobSettings();
  const result = !row.active
    ? notSent("subscription removed")
    : !row.ownerActive
      ? notSent("not sent: the subscriber's account is deactivated")
      : await postWebhook(
          row.url,
          row.body,
          {
            "content-type": "application/json",
            "user-agent": "Bandgate-Webhook/1",
            [SIGNATURE_HEADER]: signWebhookBody(row.secret, row.body),
            "Bandgate-Event": event,
            "Bandgate-Delivery": row.id,
          },
          { resolve, allowed: settings.WEBHOOK_ALLOW_NETWORKS, timeoutMs: settings.WEBHOOK_TIMEOUT_MS },
        );
  await db.insert(webhookAttempts).values({ deliveryId, attempt, statusCode: result.statusCode, error: result.error, durationMs: Math.round(result.ms), responseExcerpt: result.excerpt });
  if (result.error === null) {
    await db.update(webhookDeliveries).set({ status: "delivered", deliveredAt: new Date(), updatedAt: new Date() }).where(eq(webhookDeliveries.id, deliveryId));
    return;
  }
  if (isLastTry || result.final) {
    await db.update(webhookDeliveries).set({ status: "failed", updatedAt: new Date() }).where(eq(webhookDeliveries.id, deliveryId));
    return;
  }
  throw new DeliveryFailed(`delivery ${deliveryId} attempt ${attempt}: ${result.error}`);
}
