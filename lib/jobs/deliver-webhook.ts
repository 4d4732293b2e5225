import "server-only";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { webhookAttempts, webhookDeliveries, webhookSubscriptions } from "@/db/schema";
import { resolveHost } from "@/lib/registry/resolve-host";
import { SIGNATURE_HEADER, signWebhookBody } from "@/lib/registry/signing";
import { webhookTargetProblem } from "@/lib/registry/webhook-target";
import { jobSettings } from "./settings";

export class DeliveryFailed extends Error {}

const EXCERPT = 500;

async function post(url: string, body: string, headers: Record<string, string>) {
  const started = performance.now();
  try {
    const res = await fetch(url, { method: "POST", body, headers, redirect: "manual", signal: AbortSignal.timeout(jobSettings().WEBHOOK_TIMEOUT_MS) });
    const text = (await res.text().catch(() => "")).slice(0, EXCERPT);
    return { statusCode: res.status, error: res.ok ? null : `HTTP ${res.status}`, excerpt: text || null, ms: performance.now() - started };
  } catch (err) {
    const message = err instanceof Error ? (err.name === "TimeoutError" ? "timed out" : (err.cause as Error | undefined)?.message ?? err.message) : String(err);
    return { statusCode: null, error: message, excerpt: null, ms: performance.now() - started };
  }
}

/**
 * One attempt of one webhook delivery: POST the stored body, signed, and log the attempt. A non-2xx answer or a
 * network error throws, so pg-boss retries it with backoff; after the last retry the delivery is marked failed.
 */
export async function deliverWebhook(deliveryId: string, isLastTry: boolean): Promise<void> {
  const [row] = await db
    .select({ id: webhookDeliveries.id, eventId: webhookDeliveries.eventId, body: webhookDeliveries.body, status: webhookDeliveries.status, url: webhookSubscriptions.url, secret: webhookSubscriptions.secret, active: webhookSubscriptions.active })
    .from(webhookDeliveries)
    .innerJoin(webhookSubscriptions, eq(webhookSubscriptions.id, webhookDeliveries.subscriptionId))
    .where(eq(webhookDeliveries.id, deliveryId));
  if (!row || row.status !== "pending") return;
  const event = (JSON.parse(row.body) as { event: string }).event;
  const [{ attempt }] = await db
    .update(webhookDeliveries)
    .set({ attempts: sql`${webhookDeliveries.attempts} + 1`, updatedAt: new Date() })
    .where(eq(webhookDeliveries.id, deliveryId))
    .returning({ attempt: webhookDeliveries.attempts });
  // Checked again at delivery time: a name that resolved to a public address when it was added may not any more.
  const refused = row.active ? await webhookTargetProblem(row.url, resolveHost, jobSettings().WEBHOOK_ALLOW_PRIVATE) : null;
  const result = !row.active
    ? { statusCode: null, error: "subscription removed", excerpt: null, ms: 0 }
    : refused
      ? { statusCode: null, error: `refused: ${refused}`, excerpt: null, ms: 0 }
      : await post(row.url, row.body, {
        "content-type": "application/json",
        "user-agent": "Bandgate-Webhook/1",
        [SIGNATURE_HEADER]: signWebhookBody(row.secret, row.body),
        "Bandgate-Event": event,
        "Bandgate-Delivery": row.id,
      });
  await db.insert(webhookAttempts).values({ deliveryId, attempt, statusCode: result.statusCode, error: result.error, durationMs: Math.round(result.ms), responseExcerpt: result.excerpt });
  if (result.error === null) {
    await db.update(webhookDeliveries).set({ status: "delivered", deliveredAt: new Date(), updatedAt: new Date() }).where(eq(webhookDeliveries.id, deliveryId));
    return;
  }
  if (isLastTry || !row.active || refused) {
    await db.update(webhookDeliveries).set({ status: "failed", updatedAt: new Date() }).where(eq(webhookDeliveries.id, deliveryId));
    return;
  }
  throw new DeliveryFailed(`delivery ${deliveryId} attempt ${attempt}: ${result.error}`);
}
