import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { releaseEvents, webhookDeliveries } from "@/db/schema";
import { stopJobQueue } from "@/lib/jobs/boss";
import { deliverWebhook } from "@/lib/jobs/deliver-webhook";
import { addWebhook, setFollowing } from "@/lib/registry/subscription-service";
import { appUrl, HttpSession } from "@/tests/support/http-session";
import { mailTo } from "@/tests/support/mailbox";
import { createPerson } from "@/tests/support/people";
import { startReceiver, type Receiver } from "@/tests/support/webhook-receiver";
import { acceptedProposal, releaseAccepted, waitFor } from "./registry-world";
import { deliveryWithLog, fannedOutRelease, pendingDelivery } from "./webhook-world";

/** Receivers listen on 127.0.0.2, the one non-public address the test set-up lets webhooks reach. */
let receiver: Receiver;
const SECRET = "deactivated-webhook-secret";

beforeAll(async () => {
  receiver = await startReceiver("127.0.0.2");
});
afterAll(async () => {
  await receiver.close();
  await stopJobQueue();
  await closeDb();
});

/** Deactivate through the admin route, as the People page does. */
async function deactivate(userId: string): Promise<void> {
  const admin = await createPerson(["admin"]);
  const session = new HttpSession(appUrl());
  expect(await session.signIn(admin.email, admin.password)).toBeNull();
  expect((await session.json(`/api/admin/users/${userId}`, "PATCH", { active: false, version: 1 })).status).toBe(200);
}

const hitsOn = (path: string) => receiver.received.filter((r) => r.path === path);

describe("a deactivated account's subscriptions", () => {
  it("get no webhook delivery and no e-mail of a later release; an active subscriber's still do", async () => {
    const { world, proposalId } = await acceptedProposal();
    const kept = await createPerson(["consumer"], "kept");
    const gone = await createPerson(["consumer"], "gone");
    for (const person of [kept, gone]) {
      await addWebhook(person, { familySlug: world.familySlug, url: receiver.url(`/${person.id}`), secret: SECRET });
      await setFollowing(person, { familySlug: world.familySlug, follow: "yes" });
    }
    await deactivate(gone.id);

    const { releaseId } = await releaseAccepted(world, proposalId, "1.1.0");
    const [event] = await db.select().from(releaseEvents).where(eq(releaseEvents.releaseId, releaseId));
    await waitFor("the event to be fanned out", async () => (await db.select().from(releaseEvents).where(eq(releaseEvents.id, event.id)))[0].fannedOutAt);
    const deliveries = await waitFor("the active subscriber's delivery", async () => {
      const rows = await db.select().from(webhookDeliveries).where(eq(webhookDeliveries.eventId, event.id));
      return rows.length > 0 && rows.every((r) => r.status !== "pending") ? rows : null;
    }, 60);
    expect(deliveries.map((d) => d.status)).toEqual(["delivered"]);
    expect(hitsOn(`/${kept.id}`)).toHaveLength(1);
    expect(hitsOn(`/${gone.id}`)).toHaveLength(0);
    await waitFor("the active follower's e-mail", async () => (await mailTo(kept.email)).length === 1);
    expect(await mailTo(gone.email)).toHaveLength(0);
  }, 120_000);

  it("leave a pending delivery unsent when the account is deactivated before it goes out, and the log says why", async () => {
    const { world, eventId } = await fannedOutRelease();
    const owner = await createPerson(["consumer"]);
    const { id } = await addWebhook(owner, { familySlug: world.familySlug, url: receiver.url(`/${owner.id}`), secret: SECRET });
    const deliveryId = await pendingDelivery(eventId, id, world.familySlug);
    await deactivate(owner.id);

    await deliverWebhook(deliveryId, false);
    const { delivery, attempts } = await deliveryWithLog(deliveryId);
    expect(hitsOn(`/${owner.id}`)).toHaveLength(0);
    expect(delivery.status).toBe("failed");
    expect(attempts.map((a) => [a.statusCode, a.error])).toEqual([[null, "not sent: the subscriber's account is deactivated"]]);
  });
});
