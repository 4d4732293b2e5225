import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { releaseEvents, webhookAttempts, webhookDeliveries } from "@/db/schema";
import type { BoardWorld } from "@/tests/support/board-fixtures";
import { acceptedProposal, releaseAccepted, waitFor } from "./registry-world";

/** A release whose event the worker has already fanned out (to nobody yet): later subscriptions get no job. */
export async function fannedOutRelease(): Promise<{ world: BoardWorld; eventId: string }> {
  const { world, proposalId } = await acceptedProposal();
  const { releaseId } = await releaseAccepted(world, proposalId, "1.1.0");
  const eventId = await waitFor("the release event to be fanned out", async () => {
    const [event] = await db.select().from(releaseEvents).where(eq(releaseEvents.releaseId, releaseId));
    return event?.fannedOutAt ? event.id : null;
  });
  return { world, eventId };
}

/** A pending delivery of that event to a subscription, queued for nobody: the test runs the delivery itself. */
export async function pendingDelivery(eventId: string, subscriptionId: string, familySlug: string): Promise<string> {
  const body = JSON.stringify({ event: "release.published", eventId, family: { slug: familySlug }, release: { version: "1.1.0" } });
  const [row] = await db.insert(webhookDeliveries).values({ eventId, subscriptionId, body }).returning({ id: webhookDeliveries.id });
  return row.id;
}

export async function deliveryWithLog(deliveryId: string) {
  const [delivery] = await db.select().from(webhookDeliveries).where(eq(webhookDeliveries.id, deliveryId));
  const attempts = await db.select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, deliveryId)).orderBy(webhookAttempts.attempt);
  return { delivery, attempts };
}
