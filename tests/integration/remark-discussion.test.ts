import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { actOnRemark, createRemark } from "@/board/remarks";
import { assignReviewer, giveVerdict, moveProposal } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { remarks, users } from "@/db/schema";
import { createBoardWorld, draftProposal, versionOf, type BoardWorld } from "../support/board-fixtures";
import { appUrl, HttpSession } from "../support/http-session";
import { mailTo } from "../support/mailbox";
import { createPerson } from "../support/people";
import { releaseAccepted, waitFor } from "./registry-world";

afterAll(closeDb);

async function sessionFor(person: { email: string; password: string }) {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

/** Under review with two assigned reviewers who both accepted; the family needs two accepts. */
async function underReview() {
  const world = await createBoardWorld();
  const id = await draftProposal(world);
  await moveProposal(world.author, { proposalId: id, version: await versionOf(id), to: "submitted" });
  for (const r of world.reviewers.slice(0, 2)) await assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: r.id });
  await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "under_review" });
  for (const r of world.reviewers.slice(0, 2)) await giveVerdict(r, { proposalId: id, verdict: "accept", summary: "fine" });
  return { world, id };
}

const handle = (p: { email: string }) => p.email.split("@")[0];

describe("who reads remarks and who hears of a mention", () => {
  it("lists remarks to the review roles (as the review workspace shows them) and to nobody else", async () => {
    const { world, id } = await underReview();
    await createRemark(world.reviewers[0], { proposalId: id, body: "listed remark", blocking: false, anchor: { kind: "proposal" } });
    const path = `/api/proposals/${id}/remarks`;
    expect((await new HttpSession(appUrl()).fetch(path)).status).toBe(401);
    const consumer = await sessionFor(world.stranger);
    const refused = await consumer.fetch(path);
    expect(refused.status).toBe(403);
    expect(await refused.text()).not.toContain("listed remark");
    for (const reader of [world.author, world.reviewers[2], world.curator, await createPerson(["admin"])]) {
      const res = await (await sessionFor(reader)).fetch(path);
      expect(res.status).toBe(200);
      expect((await res.json()).remarks.map((r: { body: string }) => r.body)).toEqual(["listed remark"]);
    }
  });

  it("mails a mention only to people who may read the proposal", async () => {
    const { world, id } = await underReview();
    const unassigned = world.reviewers[2];
    const consumer = world.stranger;
    const gone = await createPerson(["reviewer"]);
    await db.update(users).set({ active: false }).where(eq(users.id, gone.id));
    const reviewer = await sessionFor(world.reviewers[0]);
    const body = `@${handle(consumer)} @${handle(gone)} @${handle(unassigned)} the secret gap is 1.234 eV`;
    expect((await reviewer.json(`/api/proposals/${id}/remarks`, "POST", { body, anchor: { kind: "proposal" } })).status).toBe(201);
    await waitFor("the mention mail to a reviewer", async () => (await mailTo(unassigned.email)).some((m) => m.textBody.includes("secret gap")));
    expect((await mailTo(consumer.email)).filter((m) => m.textBody.includes("secret gap"))).toHaveLength(0);
    expect((await mailTo(gone.email)).filter((m) => m.textBody.includes("secret gap"))).toHaveLength(0);
  });
});

type Closing = "withdrawn" | "declined" | "released";

async function close(world: BoardWorld, id: string, how: Closing) {
  const version = await versionOf(id);
  if (how === "withdrawn") await moveProposal(world.author, { proposalId: id, version, to: "withdrawn" });
  if (how === "declined") await moveProposal(world.curator, { proposalId: id, version, to: "declined", reason: "Not this way." });
  if (how === "released") {
    await moveProposal(world.curator, { proposalId: id, version, to: "accepted" });
    await releaseAccepted(world, id, "1.1.0");
  }
}

async function remarkRow(id: string) {
  const [row] = await db.select().from(remarks).where(eq(remarks.id, id));
  return row;
}

describe("the discussion closes with the proposal", () => {
  for (const how of ["withdrawn", "declined", "released"] as const) {
    it(`refuses new remarks, edits, address, resolve and reopen once the proposal is ${how}`, async () => {
      const { world, id } = await underReview();
      const [writer] = world.reviewers;
      const mk = async (body: string) => (await createRemark(writer, { proposalId: id, body, blocking: false, anchor: { kind: "proposal" } })).remarkId;
      const open = await mk("still open");
      const addressed = await mk("addressed one");
      await actOnRemark(world.author, { remarkId: addressed, version: 1, action: "address" });
      const resolved = await mk("resolved one");
      await actOnRemark(writer, { remarkId: resolved, version: 1, action: "resolve" });
      await close(world, id, how);
      const before = await db.select().from(remarks).where(eq(remarks.proposalId, id));

      const author = await sessionFor(world.author);
      const reviewer = await sessionFor(writer);
      const attempts = [
        await reviewer.json(`/api/proposals/${id}/remarks`, "POST", { body: "one more thing", anchor: { kind: "proposal" } }),
        await author.json(`/api/proposals/${id}/remarks`, "POST", { body: "a late reply", anchor: { kind: "proposal" }, parentId: open }),
        await reviewer.json(`/api/remarks/${open}`, "PATCH", { version: (await remarkRow(open)).version, body: "rewritten afterwards" }),
        await author.json(`/api/remarks/${open}`, "PATCH", { version: (await remarkRow(open)).version, action: "address" }),
        await reviewer.json(`/api/remarks/${addressed}`, "PATCH", { version: (await remarkRow(addressed)).version, action: "resolve" }),
        await reviewer.json(`/api/remarks/${resolved}`, "PATCH", { version: (await remarkRow(resolved)).version, action: "reopen" }),
      ];
      for (const res of attempts) {
        expect(res.status).toBe(422);
        expect((await res.json()).error.code).toBe("refused:closed");
      }
      expect(await db.select().from(remarks).where(eq(remarks.proposalId, id))).toEqual(before);
    });
  }

  it("keeps the discussion open while the proposal is in revision", async () => {
    const { world, id } = await underReview();
    const { remarkId } = await createRemark(world.reviewers[0], { proposalId: id, body: "please redo", blocking: false, anchor: { kind: "proposal" } });
    await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "revision", reason: "Redo the fit." });
    const author = await sessionFor(world.author);
    const res = await author.json(`/api/remarks/${remarkId}`, "PATCH", { version: 1, action: "address" });
    expect(res.status).toBe(200);
  });
});
