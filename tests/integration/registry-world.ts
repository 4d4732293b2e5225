import { eq } from "drizzle-orm";
import { assignReviewer, giveVerdict, moveProposal } from "@/board/service";
import { releaseProposal } from "@/board/release";
import { db } from "@/db/client";
import { releases } from "@/db/schema";
import { createBoardWorld, draftProposal, versionOf, type BoardWorld } from "@/tests/support/board-fixtures";

/** A family (release 1.0.0) with one accepted proposal that changes sp_sigma, ready to release. */
export async function acceptedProposal(world?: BoardWorld, value = 1.9): Promise<{ world: BoardWorld; proposalId: string }> {
  world ??= await createBoardWorld({ requiredAccepts: 1 });
  const proposalId = await draftProposal(world, value);
  const move = async (actor: BoardWorld["author"], to: "submitted" | "under_review" | "accepted") =>
    moveProposal(actor, { proposalId, version: await versionOf(proposalId), to });
  await move(world.author, "submitted");
  await assignReviewer(world.curator, { proposalId, version: await versionOf(proposalId), reviewerId: world.reviewers[0].id });
  await move(world.curator, "under_review");
  await giveVerdict(world.reviewers[0], { proposalId, verdict: "accept", summary: "ok" });
  await move(world.curator, "accepted");
  return { world, proposalId };
}

export async function releaseAccepted(world: BoardWorld, proposalId: string, releaseVersion: string) {
  return releaseProposal(world.curator, { proposalId, version: await versionOf(proposalId), releaseVersion, changelog: `Release ${releaseVersion} for tests.` });
}

export async function releaseRow(id: string) {
  const [row] = await db.select().from(releases).where(eq(releases.id, id));
  return row;
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, seconds = 25): Promise<T> {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
