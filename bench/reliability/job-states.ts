import { and, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { releaseEvents, webhookDeliveries } from "@/db/schema";
import type { WebhookReceiver } from "./receiver";

/** pg-boss's own record of the jobs with these ids (job ids are fit, event and delivery ids in Bandgate). */
export async function jobStates(ids: string[]): Promise<Map<string, number>> {
  if (!ids.length) return new Map();
  const result = await db.execute<{ name: string; state: string; n: number }>(
    sql`select name, state::text as state, count(*)::int as n from pgboss.job where id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)}) group by name, state order by name, state`,
  );
  return new Map(result.rows.map((r) => [`${r.name} ${r.state}`, r.n]));
}

export async function releaseEventId(releaseId: string): Promise<string> {
  const [row] = await db.select({ id: releaseEvents.id }).from(releaseEvents).where(eq(releaseEvents.releaseId, releaseId));
  if (!row) throw new Error(`no release event for release ${releaseId}`);
  return row.id;
}

export interface FanOutTally {
  subscriptions: number;
  delivered: number;
  failed: number;
  pending: number;
  /** Subscriptions whose receiver answered no POST of this event. */
  lost: number;
  /** Subscriptions that received more than one distinct delivery id for the event (must be none). */
  split: number;
  /** POSTs beyond the first of one delivery id (the same delivery sent again). */
  duplicates: number;
  deliveryIds: string[];
}

/** The event's deliveries as the database and the receiver saw them, per subscription. */
export async function tallyFanOut(eventId: string, subscriptionIds: string[], receiver: WebhookReceiver): Promise<FanOutTally> {
  const mine = subscriptionIds.length
    ? await db
      .select({ id: webhookDeliveries.id, subscriptionId: webhookDeliveries.subscriptionId, status: webhookDeliveries.status })
      .from(webhookDeliveries)
      .where(and(eq(webhookDeliveries.eventId, eventId), inArray(webhookDeliveries.subscriptionId, subscriptionIds)))
    : [];
  const receipts = receiver.forEvent(eventId);
  let lost = 0;
  let split = 0;
  for (const sub of subscriptionIds) {
    const ids = new Set(mine.filter((r) => r.subscriptionId === sub).map((r) => r.id));
    const got = new Set(receipts.filter((r) => ids.has(r.deliveryId)).map((r) => r.deliveryId));
    if (got.size === 0) lost++;
    if (got.size > 1) split++;
  }
  const perId = new Map<string, number>();
  for (const r of receipts) perId.set(r.deliveryId, (perId.get(r.deliveryId) ?? 0) + 1);
  return {
    subscriptions: subscriptionIds.length,
    delivered: mine.filter((r) => r.status === "delivered").length,
    failed: mine.filter((r) => r.status === "failed").length,
    pending: mine.filter((r) => r.status === "pending").length,
    lost,
    split,
    duplicates: [...perId.values()].reduce((sum, n) => sum + n - 1, 0),
    deliveryIds: mine.map((r) => r.id),
  };
}

export function describeStates(states: Map<string, number>): string {
  return [...states].map(([k, n]) => `${n} ${k}`).join(", ") || "none";
}

/** Jobs among `ids` that are not finished, with when pg-boss will give up on an active one (its expiry). */
export async function unfinishedJobs(ids: string[]): Promise<string[]> {
  if (!ids.length) return [];
  const result = await db.execute<{ name: string; state: string; started: number | null; expire: number }>(
    sql`select name, state::text as state, extract(epoch from now() - started_on)::int as started, extract(epoch from expire_in)::int as expire
        from pgboss.job where id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)}) and state not in ('completed', 'failed', 'cancelled')`,
  );
  return result.rows.map((r) =>
    r.state === "active" && r.started !== null
      ? `${r.name} active for ${r.started} s; pg-boss expires it (and retries it) only after ${r.expire} s`
      : `${r.name} ${r.state}`,
  );
}
