import "server-only";
import { eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { proposals, remarks } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { storeMarkdownHtml } from "./markdown-html";
import { notifyMentions } from "./notify";
import { getAssignedReviewerIds, getFamilyCuratorIds, getLatestRevision } from "./queries";
import { decideRemarkAction, isDiscussionOpen, mayFlagBlocking, mayWriteRemark, mentionedHandles, nextStatus, type RemarkContext } from "./remark-rules";
import type { CreateRemarkInput, EditRemarkInput, RemarkActionInput } from "./remark-schemas";
import type { Stage } from "./stages";

/** Holds the proposal row (shared) until commit, so a move that closes it waits for, or is seen by, this change. */
async function contextOf(tx: Tx, proposalId: string): Promise<RemarkContext & { stage: Stage }> {
  const [p] = await tx
    .select({ authorId: proposals.authorId, familyId: proposals.familyId, stage: proposals.stage })
    .from(proposals)
    .where(eq(proposals.id, proposalId))
    .for("share");
  if (!p) throw new AppError("not-found:proposal", "That proposal does not exist.");
  return { authorId: p.authorId, stage: p.stage, assignedReviewerIds: await getAssignedReviewerIds(tx, proposalId), familyCuratorIds: await getFamilyCuratorIds(tx, p.familyId) };
}

function assertDiscussionOpen(stage: Stage): void {
  if (!isDiscussionOpen(stage)) throw new AppError("refused:closed", "This proposal is closed; its discussion is read-only.");
}

/** A remark on the latest revision; a reply joins its thread (same anchor, never blocking on its own). */
export async function createRemark(actor: SessionUser, input: CreateRemarkInput): Promise<{ remarkId: string }> {
  const result = await db.transaction(async (tx) => {
    const ctx = await contextOf(tx, input.proposalId);
    if (!mayWriteRemark(actor, ctx)) throw new AppError("forbidden:remark", "Only the author, assigned reviewers and the family's curators write remarks here.");
    assertDiscussionOpen(ctx.stage);
    let anchor = input.anchor;
    if (input.parentId) {
      const [parent] = await tx.select({ proposalId: remarks.proposalId, anchor: remarks.anchor, parentId: remarks.parentId }).from(remarks).where(eq(remarks.id, input.parentId));
      if (!parent || parent.proposalId !== input.proposalId) throw new AppError("not-found:remark", "The remark you answer does not exist.");
      if (parent.parentId) throw new AppError("invalid:thread", "Answer the first remark of the thread.");
      anchor = parent.anchor as typeof anchor;
    }
    if (input.blocking && (input.parentId || !mayFlagBlocking(actor, ctx))) {
      throw new AppError("forbidden:blocking", "Only assigned reviewers and curators can open a blocking remark (replies never block).", { blocking: ["Not allowed for you here."] });
    }
    const latest = await getLatestRevision(tx, input.proposalId);
    if (!latest) throw new AppError("invalid:revision", "The proposal has no revision to remark on.");
    const [row] = await tx
      .insert(remarks)
      .values({ proposalId: input.proposalId, revisionId: latest.id, authorId: actor.id, parentId: input.parentId ?? null, body: input.body, blocking: input.blocking, anchor })
      .returning({ id: remarks.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "remark.created",
      subjectType: "proposal",
      subjectId: input.proposalId,
      after: { remarkId: row.id, blocking: input.blocking, anchor, revision: latest.number },
    });
    return { remarkId: row.id };
  });
  await storeMarkdownHtml(input.body);
  await notifyMentions(input.proposalId, mentionedHandles(input.body), actor, input.body);
  return result;
}

async function lockRemark(tx: Tx, remarkId: string, version: number) {
  const [row] = await tx.select().from(remarks).where(eq(remarks.id, remarkId)).for("update");
  if (!row) throw new AppError("not-found:remark", "That remark does not exist.");
  if (row.version !== version) throw new AppError("conflict:stale", "The remark changed while you were reading it; reload to see the current text and state.");
  return row;
}

export async function actOnRemark(actor: SessionUser, input: RemarkActionInput): Promise<{ status: string }> {
  return db.transaction(async (tx) => {
    const remark = await lockRemark(tx, input.remarkId, input.version);
    const ctx = await contextOf(tx, remark.proposalId);
    const refusal = decideRemarkAction(actor, ctx, { writerId: remark.authorId, status: remark.status }, input.action);
    if (refusal) throw new AppError("forbidden:remark", refusal);
    assertDiscussionOpen(ctx.stage);
    const status = nextStatus(input.action);
    await tx.update(remarks).set({ status, version: remark.version + 1, updatedAt: new Date() }).where(eq(remarks.id, remark.id));
    await recordAudit(tx, { actorId: actor.id, action: `remark.${input.action}`, subjectType: "proposal", subjectId: remark.proposalId, before: { remarkId: remark.id, status: remark.status }, after: { status } });
    return { status };
  });
}

/** Only its writer edits a remark; the previous text stays in the audit trail, and the stored HTML follows the new one. */
export async function editRemark(actor: SessionUser, input: EditRemarkInput): Promise<void> {
  await db.transaction(async (tx) => {
    const remark = await lockRemark(tx, input.remarkId, input.version);
    if (remark.authorId !== actor.id) throw new AppError("forbidden:remark", "Only the writer edits a remark.");
    assertDiscussionOpen((await contextOf(tx, remark.proposalId)).stage);
    await tx.update(remarks).set({ body: input.body, version: remark.version + 1, updatedAt: new Date() }).where(eq(remarks.id, remark.id));
    await recordAudit(tx, { actorId: actor.id, action: "remark.edited", subjectType: "proposal", subjectId: remark.proposalId, before: { remarkId: remark.id, body: remark.body }, after: { body: input.body } });
  });
  await storeMarkdownHtml(input.body);
}
