import { createHmac } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { webhookAttempts, webhookDeliveries } from "@/db/schema";
import { stopJobQueue } from "@/lib/jobs/boss";
import { addWebhook, setFollowing } from "@/lib/registry/subscription-service";
import { mailTo } from "@/tests/support/mailbox";
import { createPerson } from "@/tests/support/people";
import { startReceiver, type Receiver } from "@/tests/support/webhook-receiver";
import { acceptedProposal, releaseAccepted, waitFor } from "./registry-world";

/** Receives on 127.0.0.2, the one non-public address the test set-up lets webhooks reach (scripts/test.sh). */
let receiver: Receiver;

beforeAll(async () => {
  receiver = await startReceiver("127.0.0.2");
});
afterAll(async () => {
  await stopJobQueue();
  await receiver.close();
});

const SECRET = "integration-webhook-secret";

/** Verified here with node:crypto directly, as a subscriber would, not with the app's own signing module. */
function expectedSignature(body: string): string {
  return `hmac-sha256=${createHmac("sha256", SECRET).update(body).digest("hex")}`;
}

async function deliveriesOf(path: string) {
  return receiver.received.filter((r) => (JSON.parse(r.body) as { family: { slug: string } }).family.slug === path);
}

describe("webhooks on release", () => {
  it("POST a JSON body signed with HMAC-SHA256 to the subscriber", async () => {
    const { world, proposalId } = await acceptedProposal();
    const subscriber = await createPerson(["consumer"]);
    await addWebhook(subscriber, { familySlug: world.familySlug, url: receiver.url("/hook"), secret: SECRET });
    await releaseAccepted(world, proposalId, "1.1.0");

    const [hit] = await waitFor("the webhook POST", async () => {
      const mine = await deliveriesOf(world.familySlug);
      return mine.length ? mine : null;
    });
    expect(hit.headers["content-type"]).toBe("application/json");
    expect(hit.headers["bandgate-signature"]).toBe(expectedSignature(hit.body));
    expect(hit.headers["bandgate-event"]).toBe("release.published");
    const payload = JSON.parse(hit.body) as { event: string; release: { version: string; sha256: string; document: string } };
    expect(payload.event).toBe("release.published");
    expect(payload.release.version).toBe("1.1.0");
    expect(payload.release.document).toMatch(new RegExp(`/api/v1/families/${world.familySlug}/releases/1\\.1\\.0/document$`));

    const [delivery] = await waitFor("the delivery log", async () => {
      const rows = await db.select().from(webhookDeliveries).where(eq(webhookDeliveries.id, String(hit.headers["bandgate-delivery"])));
      return rows[0]?.status === "delivered" ? rows : null;
    });
    expect(delivery.attempts).toBe(1);
  });

  it("retry with backoff after the receiver first fails, and log every attempt", async () => {
    const { world, proposalId } = await acceptedProposal();
    const subscriber = await createPerson(["consumer"]);
    const { id: subscriptionId } = await addWebhook(subscriber, { familySlug: world.familySlug, url: receiver.url("/flaky"), secret: SECRET });
    receiver.script.push(503);
    await releaseAccepted(world, proposalId, "1.1.0");

    const delivery = await waitFor("a delivered retry", async () => {
      const [row] = await db.select().from(webhookDeliveries).where(eq(webhookDeliveries.subscriptionId, subscriptionId));
      return row?.status === "delivered" ? row : null;
    });
    expect(delivery.attempts).toBe(2);
    const attempts = await db.select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, delivery.id)).orderBy(webhookAttempts.attempt);
    expect(attempts.map((a) => [a.attempt, a.statusCode])).toEqual([
      [1, 503],
      [2, 200],
    ]);
    expect(attempts[1].createdAt.getTime() - attempts[0].createdAt.getTime()).toBeGreaterThanOrEqual(900);
    const bodies = (await deliveriesOf(world.familySlug)).map((r) => r.body);
    expect(bodies).toHaveLength(2);
    expect(bodies[0]).toBe(bodies[1]);
  });
});

describe("e-mail to family subscribers", () => {
  it("tells a follower about a release through the mail module", async () => {
    const { world, proposalId } = await acceptedProposal();
    const follower = await createPerson(["consumer"], "follower");
    await setFollowing(follower, { familySlug: world.familySlug, follow: "yes" });
    await releaseAccepted(world, proposalId, "1.1.0");
    const [mail] = await waitFor("the release e-mail", async () => {
      const box = await mailTo(follower.email);
      return box.length ? box : null;
    });
    expect(mail.subject).toBe(`Family ${world.familySlug} 1.1.0 is released`);
    expect(mail.textBody).toContain(`/registry/${world.familySlug}/1.1.0`);
  });
});
