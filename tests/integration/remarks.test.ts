import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { createRemark, actOnRemark, editRemark } from "@/board/remarks";
import { assignReviewer, giveVerdict, moveProposal } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { auditEvents, remarks } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { createBoardWorld, draftProposal, versionOf } from "../support/board-fixtures";
import { mailTo } from "../support/mailbox";

afterAll(closeDb);

async function reviewWorld() {
  const world = await createBoardWorld();
  const id = await draftProposal(world);
  await moveProposal(world.author, { proposalId: id, version: await versionOf(id), to: "submitted" });
  for (const r of world.reviewers.slice(0, 2)) await assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: r.id });
  await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "under_review" });
  for (const r of world.reviewers.slice(0, 2)) await giveVerdict(r, { proposalId: id, verdict: "accept", summary: "fine" });
  return { world, id };
}

async function version(remarkId: string) {
  const [row] = await db.select({ version: remarks.version }).from(remarks).where(eq(remarks.id, remarkId));
  return row.version;
}

describe("remarks against the real database", () => {
  it("a blocking remark holds acceptance until the author addresses it and the reviewer resolves it", async () => {
    const { world, id } = await reviewWorld();
    const [reviewer] = world.reviewers;
    const { remarkId } = await createRemark(reviewer, { proposalId: id, body: "Why does $E_g$ move?", blocking: true, anchor: { kind: "parameter", key: "shell/A-A/1/sp_sigma" } });
    const refused = await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "accepted" }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).message).toContain("1 blocking remark still open");

    await expect(actOnRemark(reviewer, { remarkId, version: await version(remarkId), action: "address" })).rejects.toThrow(/author/);
    await actOnRemark(world.author, { remarkId, version: await version(remarkId), action: "address" });
    await expect(moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "accepted" })).rejects.toThrow(/blocking/);
    await actOnRemark(reviewer, { remarkId, version: await version(remarkId), action: "resolve" });
    await moveProposal(world.curator, { proposalId: id, version: await versionOf(id), to: "accepted" });
  });

  it("refuses blocking remarks from the author, remarks from outsiders, and stale state changes", async () => {
    const { world, id } = await reviewWorld();
    await expect(createRemark(world.author, { proposalId: id, body: "I insist", blocking: true, anchor: { kind: "proposal" } })).rejects.toThrow(/blocking/);
    await expect(createRemark(world.reviewers[2], { proposalId: id, body: "drive-by", blocking: false, anchor: { kind: "proposal" } })).rejects.toThrow(/Only the author/);
    const { remarkId } = await createRemark(world.reviewers[0], { proposalId: id, body: "note", blocking: false, anchor: { kind: "proposal" } });
    const stale = await version(remarkId);
    await actOnRemark(world.author, { remarkId, version: stale, action: "address" });
    await expect(actOnRemark(world.reviewers[0], { remarkId, version: stale, action: "resolve" })).rejects.toThrow(/changed while you were reading/);
  });

  it("keeps the previous text in the audit trail when a remark is edited, and only its writer may edit", async () => {
    const { world, id } = await reviewWorld();
    const { remarkId } = await createRemark(world.reviewers[0], { proposalId: id, body: "first words", blocking: false, anchor: { kind: "proposal" } });
    await expect(editRemark(world.author, { remarkId, version: await version(remarkId), body: "hijack" })).rejects.toThrow(/writer/);
    await editRemark(world.reviewers[0], { remarkId, version: await version(remarkId), body: "better words" });
    const edits = (await db.select().from(auditEvents).where(eq(auditEvents.subjectId, id))).filter((e) => e.action === "remark.edited");
    expect(edits).toHaveLength(1);
    expect(edits[0]).toMatchObject({ before: { remarkId, body: "first words" }, after: { body: "better words" } });
  });

  it("replies join the thread with its anchor and mentions notify colleagues by e-mail", async () => {
    const { world, id } = await reviewWorld();
    const handle = world.author.email.split("@")[0];
    const { remarkId } = await createRemark(world.reviewers[0], { proposalId: id, body: `@${handle} see the zone edge`, blocking: false, anchor: { kind: "k-range", from: "Γ", to: "X" } });
    const mail = await mailTo(world.author.email);
    expect(mail.some((m) => m.subject.includes("mentioned you") && m.textBody.includes("see the zone edge"))).toBe(true);
    const { remarkId: replyId } = await createRemark(world.author, { proposalId: id, body: "fixed in r3", blocking: false, anchor: { kind: "proposal" }, parentId: remarkId });
    const [reply] = await db.select().from(remarks).where(eq(remarks.id, replyId));
    expect(reply.anchor).toEqual({ kind: "k-range", from: "Γ", to: "X" });
  });

  it("tells reviewers they were assigned and the author about verdicts and decisions", async () => {
    const { world } = await reviewWorld();
    const reviewerMail = await mailTo(world.reviewers[0].email);
    expect(reviewerMail.some((m) => m.subject.startsWith("Review requested"))).toBe(true);
    const authorMail = await mailTo(world.author.email);
    expect(authorMail.filter((m) => m.subject.startsWith("Verdict on"))).toHaveLength(2);
  });
});
