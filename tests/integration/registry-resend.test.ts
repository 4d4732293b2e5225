import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { releaseEvents } from "@/db/schema";
import { jobQueue, stopJobQueue } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { requeueUnsentReleaseEvents } from "@/lib/jobs/unsent-release-events";
import { setFollowing } from "@/lib/registry/subscription-service";
import { mailTo } from "@/tests/support/mailbox";
import { createPerson } from "@/tests/support/people";
import { acceptedProposal, releaseAccepted, waitFor } from "./registry-world";

afterAll(stopJobQueue);

/** A release with one e-mail follower, already told about it once through the normal path. */
async function releasedWithFollower() {
  const { world, proposalId } = await acceptedProposal();
  const follower = await createPerson(["consumer"], "follower");
  await setFollowing(follower, { familySlug: world.familySlug, follow: "yes" });
  const { releaseId } = await releaseAccepted(world, proposalId, "1.1.0");
  await waitFor("the first release e-mail", async () => (await mailTo(follower.email)).length === 1);
  const [event] = await db.select().from(releaseEvents).where(eq(releaseEvents.releaseId, releaseId));
  await waitFor("the first event to be marked fanned out", async () => (await db.select().from(releaseEvents).where(eq(releaseEvents.id, event.id)))[0].fannedOutAt);
  return { releaseId, follower, actorId: world.curator.id };
}

/** An event recorded as if its release had committed while the queue was unreachable: no job was ever sent. */
async function lostEvent(releaseId: string, actorId: string, minutesAgo: number) {
  const [row] = await db
    .insert(releaseEvents)
    .values({ releaseId, kind: "release.published", actorId, createdAt: new Date(Date.now() - minutesAgo * 60_000) })
    .returning({ id: releaseEvents.id });
  return row.id;
}

describe("release events whose job was lost", () => {
  it("are queued again by the sweep and reach subscribers once; fanned-out and recent events are left alone", async () => {
    const { releaseId, follower, actorId } = await releasedWithFollower();
    const lost = await lostEvent(releaseId, actorId, 10);
    const recent = await lostEvent(releaseId, actorId, 0);
    const boss = await jobQueue();

    const requeued = await requeueUnsentReleaseEvents(boss, 5 * 60_000);
    expect(requeued).toContain(lost);
    expect(requeued).not.toContain(recent);
    await waitFor("the lost event to be fanned out", async () => (await db.select().from(releaseEvents).where(eq(releaseEvents.id, lost)))[0].fannedOutAt);
    await waitFor("the second e-mail", async () => (await mailTo(follower.email)).length === 2);
    expect(await requeueUnsentReleaseEvents(boss, 5 * 60_000)).not.toContain(lost);
    // Nothing more is on its way once the event and mail queues hold no waiting or running job.
    const pending = async () => (await boss.getQueueSize(QUEUES.releaseEvent, { before: "completed" })) + (await boss.getQueueSize(QUEUES.registryMail, { before: "completed" }));
    await waitFor("the event and mail queues to drain", async () => (await pending()) === 0);
    expect(await mailTo(follower.email)).toHaveLength(2);
    // The recent one is not lost yet; mark it so the worker's own sweep leaves the shared test database quiet.
    await db.update(releaseEvents).set({ fannedOutAt: new Date() }).where(eq(releaseEvents.id, recent));
  });

  it("skip an event whose job is still waiting in the queue", async () => {
    const { releaseId, actorId } = await releasedWithFollower();
    const waiting = await lostEvent(releaseId, actorId, 10);
    const boss = await jobQueue();
    await boss.send(QUEUES.releaseEvent, { eventId: waiting }, { id: waiting, startAfter: new Date(Date.now() + 3600_000) });
    expect(await requeueUnsentReleaseEvents(boss, 5 * 60_000)).not.toContain(waiting);
    await boss.cancel(QUEUES.releaseEvent, waiting);
    await db.update(releaseEvents).set({ fannedOutAt: new Date() }).where(eq(releaseEvents.id, waiting));
  });
});
