import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { familySubscriptions, modelFamilies, webhookAttempts, webhookDeliveries, webhookSubscriptions } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { jobSettings } from "@/lib/jobs/settings";
import { resolveHost } from "./resolve-host";
import type { WebhookInput } from "./schemas";
import { NOT_PUBLIC, webhookTargetProblem, type Resolver } from "./webhook-target";

async function familyIdOf(slug: string): Promise<string> {
  const [row] = await db.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, slug));
  if (!row) throw new AppError("not-found:family", "That model family does not exist.", { familySlug: ["Unknown family."] });
  return row.id;
}

/** `resolve` is the name service used for the check (tests give their own). */
export async function addWebhook(actor: SessionUser, input: WebhookInput, resolve: Resolver = resolveHost): Promise<{ id: string }> {
  const familyId = await familyIdOf(input.familySlug);
  const problem = await webhookTargetProblem(input.url, resolve, jobSettings().WEBHOOK_ALLOW_NETWORKS);
  if (problem === NOT_PUBLIC) {
    const why = "it is not a public address (loopback, private, link-local and other special-purpose addresses are never called)";
    throw new AppError("invalid:webhook-url", `Bandgate will not call that address: ${why}.`, { url: ["Not a public address: give one reachable from the internet."] });
  }
  if (problem) throw new AppError("invalid:webhook-url", `Bandgate will not call that address: ${problem}.`, { url: [`Not allowed: ${problem}.`] });
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(webhookSubscriptions).values({ userId: actor.id, familyId, url: input.url, secret: input.secret }).returning({ id: webhookSubscriptions.id });
    await recordAudit(tx, { actorId: actor.id, action: "webhook.added", subjectType: "webhook-subscription", subjectId: row.id, after: { family: input.familySlug, url: input.url } });
    return row;
  });
}

export async function removeWebhook(actor: SessionUser, input: { subscriptionId: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .update(webhookSubscriptions)
      .set({ active: false })
      .where(and(eq(webhookSubscriptions.id, input.subscriptionId), eq(webhookSubscriptions.userId, actor.id), eq(webhookSubscriptions.active, true)))
      .returning({ id: webhookSubscriptions.id, url: webhookSubscriptions.url });
    if (!row) throw new AppError("not-found:subscription", "No such active webhook of yours.");
    await recordAudit(tx, { actorId: actor.id, action: "webhook.removed", subjectType: "webhook-subscription", subjectId: row.id, before: { url: row.url } });
  });
}

export async function setFollowing(actor: SessionUser, input: { familySlug: string; follow: "yes" | "no" }): Promise<void> {
  const familyId = await familyIdOf(input.familySlug);
  if (input.follow === "yes") await db.insert(familySubscriptions).values({ userId: actor.id, familyId }).onConflictDoNothing();
  else await db.delete(familySubscriptions).where(and(eq(familySubscriptions.userId, actor.id), eq(familySubscriptions.familyId, familyId)));
}

export async function listFollowedFamilyIds(userId: string): Promise<Set<string>> {
  return new Set((await db.select({ id: familySubscriptions.familyId }).from(familySubscriptions).where(eq(familySubscriptions.userId, userId))).map((r) => r.id));
}

function summaryOf(body: string): { event: string; version: string } {
  const parsed = JSON.parse(body) as { event: string; release: { version: string } };
  return { event: parsed.event, version: parsed.release.version };
}

/** The subscriber's webhooks with their recent deliveries and each delivery's attempts (the delivery log). */
export async function listWebhooksWithLog(userId: string, perHook = 20) {
  const hooks = await db
    .select({ id: webhookSubscriptions.id, url: webhookSubscriptions.url, active: webhookSubscriptions.active, createdAt: webhookSubscriptions.createdAt, familySlug: modelFamilies.slug, familyTitle: modelFamilies.title })
    .from(webhookSubscriptions)
    .innerJoin(modelFamilies, eq(modelFamilies.id, webhookSubscriptions.familyId))
    .where(eq(webhookSubscriptions.userId, userId))
    .orderBy(desc(webhookSubscriptions.active), desc(webhookSubscriptions.createdAt));
  if (!hooks.length) return [];
  const deliveries = await db
    .select({ id: webhookDeliveries.id, subscriptionId: webhookDeliveries.subscriptionId, body: webhookDeliveries.body, status: webhookDeliveries.status, attempts: webhookDeliveries.attempts, createdAt: webhookDeliveries.createdAt, deliveredAt: webhookDeliveries.deliveredAt })
    .from(webhookDeliveries)
    .where(inArray(webhookDeliveries.subscriptionId, hooks.map((h) => h.id)))
    .orderBy(desc(webhookDeliveries.createdAt))
    .limit(perHook * hooks.length);
  const attempts = deliveries.length
    ? await db
        .select({ deliveryId: webhookAttempts.deliveryId, attempt: webhookAttempts.attempt, statusCode: webhookAttempts.statusCode, error: webhookAttempts.error, durationMs: webhookAttempts.durationMs, createdAt: webhookAttempts.createdAt })
        .from(webhookAttempts)
        .where(inArray(webhookAttempts.deliveryId, deliveries.map((d) => d.id)))
        .orderBy(webhookAttempts.attempt)
    : [];
  return hooks.map((h) => ({
    ...h,
    deliveries: deliveries
      .filter((d) => d.subscriptionId === h.id)
      .slice(0, perHook)
      .map(({ body, ...d }) => ({ ...d, ...summaryOf(body), attemptLog: attempts.filter((a) => a.deliveryId === d.id) })),
  }));
}
