import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { modelFamilies, webhookAttempts, webhookDeliveries, webhookSubscriptions } from "@/db/schema";
import { stopJobQueue } from "@/lib/jobs/boss";
import { deliverWebhook } from "@/lib/jobs/deliver-webhook";
import { addWebhook } from "@/lib/registry/subscription-service";
import { createBoardWorld } from "@/tests/support/board-fixtures";
import { appUrl, HttpSession } from "@/tests/support/http-session";
import { createPerson } from "@/tests/support/people";
import { ISSUE_TARGETS } from "@/tests/support/refused-targets";
import { actionResult, callServerAction, serverActionId, type ActionOutcome } from "@/tests/support/server-action";
import { startReceiver, type Receiver } from "@/tests/support/webhook-receiver";
import { acceptedProposal, releaseAccepted, waitFor } from "./registry-world";
import { deliveryWithLog, fannedOutRelease, pendingDelivery } from "./webhook-world";

async function submitAction(session: HttpSession, page: string, id: string, fields: Record<string, string>): Promise<ActionOutcome> {
  const { status, text } = await callServerAction(session, page, id, fields);
  const result = actionResult(text);
  if (status !== 200 || !result) throw new Error(`the action answered ${status}: ${text.slice(0, 300)}`);
  return result;
}

/**
 * The test set-up allows exactly one non-public address (WEBHOOK_ALLOW_NETWORKS=127.0.0.2/32, scripts/test.sh).
 * `inside` on 127.0.0.1 stands for a service in the private network no webhook may reach; `listed` on 127.0.0.2, on
 * the same port, is a receiver the operator allowed. Each test proves `inside` is never reached.
 */
let inside: Receiver;
let listed: Receiver;
const SECRET = "webhook-target-secret-0123";
const REFUSED = "refused: not a public address";

beforeAll(async () => {
  inside = await startReceiver("127.0.0.1");
  listed = await startReceiver("127.0.0.2", inside.port);
});
afterAll(async () => {
  await Promise.all([inside.close(), listed.close()]);
  await stopJobQueue();
  await closeDb();
});

/** Every refused form of the issue, plus the plain address and a name that resolves to it, on `inside`'s port. */
function insideUrls(): string[] {
  return [...ISSUE_TARGETS.map(([host]) => host), "127.0.0.1", "localhost"].map((host) => `http://${host}:${inside.port}/hook`);
}

async function familyIdOf(slug: string): Promise<string> {
  const [row] = await db.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, slug));
  return row.id;
}

/** A resolver that gives each answer once, in order, and then the last one again; it counts its calls. */
function answering(...answers: string[][]) {
  const resolve = async (_host: string) => answers[Math.min(resolve.calls++, answers.length - 1)];
  resolve.calls = 0;
  return resolve;
}

describe("adding a webhook in Settings (the server action over HTTP)", () => {
  it("refuses every non-public address in every notation with a clear message, stores nothing, and accepts a listed one", async () => {
    const world = await createBoardWorld();
    const person = await createPerson(["consumer"]);
    const session = new HttpSession(appUrl());
    expect(await session.signIn(person.email, person.password)).toBeNull();
    const add = serverActionId("app/(workspace)/settings/actions.ts", "addWebhookAction");

    for (const url of insideUrls()) {
      const answer = await submitAction(session, "/settings/notifications", add, { familySlug: world.familySlug, url, secret: SECRET });
      expect(answer, url).toMatchObject({ ok: false, code: "invalid:webhook-url" });
      expect(answer.error, url).toMatch(/not a public address/);
      expect(answer.fieldErrors?.url, url).toHaveLength(1);
    }
    expect(await db.select().from(webhookSubscriptions).where(eq(webhookSubscriptions.userId, person.id))).toHaveLength(0);

    const accepted = await submitAction(session, "/settings/notifications", add, { familySlug: world.familySlug, url: listed.url("/hook"), secret: SECRET });
    expect(accepted).toMatchObject({ ok: true });
    expect(await db.select().from(webhookSubscriptions).where(eq(webhookSubscriptions.userId, person.id))).toHaveLength(1);
    expect(inside.received).toHaveLength(0);
  });
});

describe("deliveries by the worker", () => {
  it("never connect to a non-public address, whatever its notation, and log a refusal without retrying", async () => {
    const { world, proposalId } = await acceptedProposal();
    const owner = await createPerson(["consumer"]);
    const familyId = await familyIdOf(world.familySlug);
    // Stored directly: the app no longer accepts them, but rows from before (or a name that changed) may exist.
    const listedUrl = listed.url(`/${world.familySlug}`);
    const subs = await db
      .insert(webhookSubscriptions)
      .values([listedUrl, ...insideUrls()].map((url) => ({ userId: owner.id, familyId, url, secret: SECRET })))
      .returning({ id: webhookSubscriptions.id, url: webhookSubscriptions.url });
    const listedSub = subs.find((s) => s.url === listedUrl)!;
    const refusedSubs = subs.filter((s) => s !== listedSub);
    await releaseAccepted(world, proposalId, "1.1.0");

    const ids = subs.map((s) => s.id);
    const deliveriesNow = () => db.select().from(webhookDeliveries).where(inArray(webhookDeliveries.subscriptionId, ids));
    await waitFor("a logged attempt of every delivery", async () => {
      const tried = (await deliveriesNow()).map((d) => d.id);
      const logged = tried.length ? await db.selectDistinct({ id: webhookAttempts.deliveryId }).from(webhookAttempts).where(inArray(webhookAttempts.deliveryId, tried)) : [];
      return tried.length === ids.length && logged.length === ids.length;
    }, 60);
    expect(inside.received).toHaveLength(0);
    const deliveries = await waitFor("every delivery to be settled", async () => {
      const rows = await deliveriesNow();
      return rows.every((r) => r.status !== "pending") ? rows : null;
    }, 60);
    expect(listed.received.filter((r) => r.path === `/${world.familySlug}`)).toHaveLength(1);
    for (const sub of refusedSubs) {
      const delivery = deliveries.find((d) => d.subscriptionId === sub.id)!;
      expect(delivery, sub.url).toMatchObject({ status: "failed", attempts: 1 });
      const attempts = await db.select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, delivery.id));
      expect(attempts.map((a) => [a.statusCode, a.error, a.responseExcerpt]), sub.url).toEqual([[null, REFUSED, null]]);
    }
    expect(deliveries.find((d) => d.subscriptionId === listedSub.id)?.status).toBe("delivered");
  }, 150_000);
});

describe("a name that answers differently over time (DNS rebinding)", () => {
  it("is refused when it connects, though it resolved to a public address when the webhook was added", async () => {
    const { world, eventId } = await fannedOutRelease();
    const owner = await createPerson(["consumer"]);
    const rebinding = answering(["93.184.216.34"], ["127.0.0.1"]);
    const { id } = await addWebhook(owner, { familySlug: world.familySlug, url: `http://hooks.rebind.test:${inside.port}/hook`, secret: SECRET }, rebinding);
    const deliveryId = await pendingDelivery(eventId, id, world.familySlug);

    await deliverWebhook(deliveryId, false, rebinding);
    const { delivery, attempts } = await deliveryWithLog(deliveryId);
    expect(inside.received).toHaveLength(0);
    expect(delivery.status).toBe("failed");
    expect(attempts.map((a) => [a.statusCode, a.error])).toEqual([[null, REFUSED]]);
  });

  it("connects to the address it checked, never to a second answer of the name", async () => {
    const { world, eventId } = await fannedOutRelease();
    const owner = await createPerson(["consumer"]);
    const [sub] = await db
      .insert(webhookSubscriptions)
      .values({ userId: owner.id, familyId: await familyIdOf(world.familySlug), url: `http://hooks.flip.test:${inside.port}/${world.familySlug}`, secret: SECRET })
      .returning({ id: webhookSubscriptions.id });
    const deliveryId = await pendingDelivery(eventId, sub.id, world.familySlug);
    const flipping = answering(["127.0.0.2"], ["127.0.0.1"]);

    await deliverWebhook(deliveryId, false, flipping);
    expect(inside.received).toHaveLength(0);
    expect(listed.received.filter((r) => r.path === `/${world.familySlug}`)).toHaveLength(1);
    expect(flipping.calls).toBe(1);
    expect((await deliveryWithLog(deliveryId)).delivery.status).toBe("delivered");
  });

  it("is refused when any of its addresses is not public", async () => {
    const { world, eventId } = await fannedOutRelease();
    const owner = await createPerson(["consumer"]);
    const [sub] = await db
      .insert(webhookSubscriptions)
      .values({ userId: owner.id, familyId: await familyIdOf(world.familySlug), url: `http://hooks.mixed.test:${inside.port}/hook`, secret: SECRET })
      .returning({ id: webhookSubscriptions.id });
    const deliveryId = await pendingDelivery(eventId, sub.id, world.familySlug);

    await deliverWebhook(deliveryId, false, answering(["127.0.0.2", "127.0.0.1"]));
    expect(inside.received).toHaveLength(0);
    expect(listed.received.filter((r) => r.path === "/hook")).toHaveLength(0);
    expect((await deliveryWithLog(deliveryId)).attempts.map((a) => a.error)).toEqual([REFUSED]);
  });
});
