import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { getBoardCard } from "@/board/queries";
import { assignReviewer, giveVerdict, moveProposal, saveRevision, waiveChecks } from "@/board/service";
import type { Stage } from "@/board/stages";
import { closeDb, db } from "@/db/client";
import { auditEvents, proposals, reviewerAssignments, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { changedChain, createBoardWorld, draftProposal, versionOf, type BoardWorld } from "../support/board-fixtures";
import { createPerson } from "../support/people";

afterAll(closeDb);

async function move(actor: SessionUser, proposalId: string, to: Stage, reason?: string) {
  return moveProposal(actor, { proposalId, version: await versionOf(proposalId), to, reason });
}

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const err = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

async function stageOf(id: string) {
  const [row] = await db.select({ stage: proposals.stage }).from(proposals).where(eq(proposals.id, id));
  return row.stage;
}

async function underReview(world: BoardWorld, reviewers = world.reviewers.slice(0, 2)) {
  const id = await draftProposal(world);
  await move(world.author, id, "submitted");
  for (const r of reviewers) await assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: r.id });
  await move(world.curator, id, "under_review");
  return id;
}

describe("the acceptance gate against the real database", () => {
  it("refuses acceptance until enough fresh accepts from assigned reviewers exist", async () => {
    const world = await createBoardWorld();
    const id = await underReview(world);
    const [a, b] = world.reviewers;
    let err = await refusal(move(world.curator, id, "accepted"));
    expect(err.code).toBe("refused:gate");
    expect(err.message).toContain("has 0");
    await giveVerdict(a, { proposalId: id, verdict: "accept", summary: "ok" });
    err = await refusal(move(world.curator, id, "accepted"));
    expect(err.message).toContain("has 1");
    await expect(giveVerdict(world.reviewers[2], { proposalId: id, verdict: "accept", summary: "not assigned" })).rejects.toThrow(/assigned/);
    await giveVerdict(b, { proposalId: id, verdict: "accept", summary: "ok" });
    await move(world.curator, id, "accepted");
    expect(await stageOf(id)).toBe("accepted");
  });

  it("makes verdicts stale when a new revision changes the physics, and keeps them for metadata-only revisions", async () => {
    const world = await createBoardWorld();
    const id = await underReview(world);
    for (const r of world.reviewers.slice(0, 2)) await giveVerdict(r, { proposalId: id, verdict: "accept", summary: "ok" });
    await move(world.curator, id, "revision", "please tidy the provenance");
    const current = changedChain(world.base, "shell/A-A/1/sp_sigma", 1.9);
    await saveRevision(world.author, { proposalId: id, version: await versionOf(id), document: { ...current, description: "metadata only" }, note: "text" });
    await move(world.author, id, "under_review");
    expect((await getBoardCard(db, id))!.tally).toMatchObject({ accept: 2, stale: 0 });

    await move(world.curator, id, "revision", "refit please");
    await saveRevision(world.author, { proposalId: id, version: await versionOf(id), document: changedChain(world.base, "shell/A-A/1/sp_sigma", 1.95), note: "physics" });
    await move(world.author, id, "under_review");
    expect((await getBoardCard(db, id))!.tally).toMatchObject({ accept: 0, stale: 2 });
    const err = await refusal(move(world.curator, id, "accepted"));
    expect(err.message).toContain("has 0");
  });

  it("refuses resubmission without a new revision", async () => {
    const world = await createBoardWorld();
    const id = await underReview(world);
    await move(world.curator, id, "revision", "needs work");
    const err = await refusal(move(world.author, id, "under_review"));
    expect(err.message).toContain("Save a new revision first");
  });

  it("needs a waiver with a reason when checks fail, and audits it", async () => {
    const world = await createBoardWorld({ criteria: [{ metric: "gap", target: 3, tolerance: 0.05 }], requiredAccepts: 1 });
    const id = await underReview(world, [world.reviewers[0]]);
    await giveVerdict(world.reviewers[0], { proposalId: id, verdict: "accept", summary: "ok" });
    const err = await refusal(move(world.curator, id, "accepted"));
    expect(err.message).toContain("Some checks fail");
    await expect(waiveChecks(world.curator, { proposalId: id, version: await versionOf(id), reason: "short" })).rejects.toThrow(/at least 10/);
    await waiveChecks(world.curator, { proposalId: id, version: await versionOf(id), reason: "gap target is for the next family version" });
    await move(world.curator, id, "accepted");
    const actions = (await db.select().from(auditEvents).where(eq(auditEvents.subjectId, id))).map((e) => e.action);
    expect(actions).toContain("proposal.checks-waived");
  });

  it("never lets the author review, and only family curators assign", async () => {
    const world = await createBoardWorld();
    await db.update(users).set({ roles: ["author", "reviewer"] }).where(eq(users.id, world.author.id));
    const id = await draftProposal(world);
    await move(world.author, id, "submitted");
    const notThisFamily = await createPerson(["curator"]);
    const byOutsider = await refusal(assignReviewer(notThisFamily, { proposalId: id, version: await versionOf(id), reviewerId: world.reviewers[0].id }));
    expect(byOutsider.code).toBe("forbidden:move");
    const self = await refusal(assignReviewer(world.curator, { proposalId: id, version: await versionOf(id), reviewerId: world.author.id }));
    expect(self.code).toBe("refused:gate");
    expect(self.message).toContain("own proposal");
    expect(await db.select().from(reviewerAssignments).where(eq(reviewerAssignments.proposalId, id))).toHaveLength(0);
  });

  it("writes an audit event for every move and none for a refused one", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    await refusal(move(world.stranger, id, "submitted"));
    await move(world.author, id, "submitted");
    const moves = (await db.select().from(auditEvents).where(eq(auditEvents.subjectId, id))).filter((e) => e.action === "proposal.moved");
    expect(moves).toHaveLength(1);
    expect(moves[0]).toMatchObject({ actorId: world.author.id, before: { stage: "draft" }, after: { stage: "submitted" } });
  });
});

describe("optimistic concurrency", () => {
  it("lets exactly one of two simultaneous moves of the same card win; the loser gets the current card", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const version = await versionOf(id);
    const results = await Promise.allSettled([
      moveProposal(world.author, { proposalId: id, version, to: "submitted" }),
      moveProposal(world.author, { proposalId: id, version, to: "withdrawn" }),
    ]);
    const won = results.filter((r) => r.status === "fulfilled");
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0].reason).toBeInstanceOf(AppError);
    expect((lost[0].reason as AppError).code).toBe("conflict:stale");
    const current = (lost[0].reason as AppError).details?.current as { stage: string; version: number };
    expect(["submitted", "withdrawn"]).toContain(current.stage);
    expect(current.version).toBe(version + 1);
  });
});
