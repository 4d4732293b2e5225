import "server-only";
import { and, eq } from "drizzle-orm";
import { blankModelDocument } from "@/lib/tb/blank-document";
import { db, type Tx } from "@/db/client";
import { proposals, reviewerAssignments, revisions, verdicts } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { hasAnyRole } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError, type ErrorCode } from "@/lib/errors";
import { loadProposalFacts } from "./facts";
import { notifyMove, notifyReviewerAssigned, notifyVerdict } from "./notify";
import { storeMarkdownHtml } from "./markdown-html";
import { getBoardCard, findFamilyBySlug, getLatestRevision, getRelease, getUserRoles, lockProposal } from "./queries";
import { admitDocument, getProposalForRevision, prepareRevision, type PreparedRevision } from "./revision-intake";
import { decideAssignReviewer, decideManageReviewers, decideMove, decideRevise, decideWaiveChecks, type MoveDecision, type RuleActor as RuleActorLike } from "./rules";
import type { AssignInput, CreateProposalInput, EditTextInput, MoveInput, SaveRevisionInput, VerdictInput, WaiveInput } from "./schemas";
import { STAGE_META } from "./stages";

export function enforce(decision: MoveDecision | { allowed: false; code: ErrorCode; reasons: string[] }): void {
  if (!decision.allowed) throw new AppError(decision.code, decision.reasons.join(" "), undefined, { reasons: decision.reasons });
}

/** Lock the card and make sure the caller saw its current version; otherwise a conflict carrying the current card. */
async function lockFresh(tx: Tx, proposalId: string, version: number) {
  const proposal = await lockProposal(tx, proposalId);
  if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist (it may have been removed).");
  if (proposal.version !== version) {
    const current = await getBoardCard(tx, proposalId);
    throw new AppError(
      "conflict:stale",
      `Someone changed this proposal while you were looking (it is now ${STAGE_META[proposal.stage].label.toLowerCase()}, version ${proposal.version}). The board shows the current state.`,
      undefined,
      { current },
    );
  }
  return proposal;
}

async function bump(tx: Tx, proposalId: string, version: number, extra: Partial<typeof proposals.$inferInsert> = {}) {
  await tx.update(proposals).set({ ...extra, version: version + 1, updatedAt: new Date() }).where(eq(proposals.id, proposalId));
}

export async function createProposal(actor: SessionUser, input: CreateProposalInput, document?: unknown): Promise<{ proposalId: string }> {
  if (!hasAnyRole(actor.roles, ["author"])) throw new AppError("forbidden:role", "Only authors may start proposals.");
  const family = await findFamilyBySlug(db, input.familySlug);
  if (!family) throw new AppError("not-found:family", "That model family does not exist.", { familySlug: ["Unknown family."] });
  const base = input.baseReleaseId ? await getRelease(db, input.baseReleaseId) : null;
  if (input.baseReleaseId && (!base || base.familyId !== family.id)) {
    throw new AppError("invalid:base", "The base release does not belong to this family.", { baseReleaseId: ["Not a release of this family."] });
  }
  const doc = await admitDocument(document ?? base?.document ?? blankModelDocument(family.dimension as 1 | 2 | 3));
  const { facts } = await prepareRevision({ familyId: family.id, baseReleaseId: base?.id ?? null }, doc);
  const result = await db.transaction(async (tx) => {
    const [proposal] = await tx
      .insert(proposals)
      .values({ familyId: family.id, baseReleaseId: base?.id ?? null, authorId: actor.id, title: input.title, rationale: input.rationale })
      .returning({ id: proposals.id });
    await tx.insert(revisions).values({ proposalId: proposal.id, number: 1, document: doc, note: "first revision", createdBy: actor.id, ...facts });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "proposal.created",
      subjectType: "proposal",
      subjectId: proposal.id,
      after: { family: family.slug, base: base?.version ?? null, title: input.title, sha256: facts.sha256 },
    });
    return { proposalId: proposal.id };
  });
  await storeMarkdownHtml(input.rationale);
  return result;
}

export async function saveRevision(actor: SessionUser, input: SaveRevisionInput): Promise<{ revision: number; version: number }> {
  const doc = await admitDocument(input.document);
  const current = await getProposalForRevision(input.proposalId);
  enforce(decideRevise(actor, current)); // before the engine works for someone who may not revise; checked again under the lock
  const prepared = await prepareRevision(current, doc);
  return db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const { revision, version } = await appendRevision(tx, actor, proposal, prepared, input.note);
    return { revision, version };
  });
}

type LockedProposal = NonNullable<Awaited<ReturnType<typeof lockProposal>>>;

/**
 * Adds the next revision to a proposal the caller has locked (rules, audit, version bump). Its facts were derived
 * before the lock (prepareRevision), so the lock is held only for the write. Shared by the editor's save and by a
 * refit's result.
 */
export async function appendRevision(
  tx: Tx,
  actor: RuleActorLike,
  proposal: LockedProposal,
  prepared: PreparedRevision,
  note: string,
  auditExtra: Record<string, unknown> = {},
): Promise<{ revision: number; version: number; revisionId: string }> {
  enforce(decideRevise(actor, proposal));
  if (prepared.baseReleaseId !== proposal.baseReleaseId) throw new Error("appendRevision: the revision was prepared against another base release");
  const { doc, facts } = prepared;
  const latest = await getLatestRevision(tx, proposal.id);
  if (latest && latest.sha256 === facts.sha256) {
    throw new AppError("invalid:unchanged", "Nothing changed since the latest revision, so no new revision was saved.");
  }
  const number = (latest?.number ?? 0) + 1;
  const [row] = await tx
    .insert(revisions)
    .values({ proposalId: proposal.id, number, document: doc, note, createdBy: actor.id, ...facts })
    .returning({ id: revisions.id });
  await bump(tx, proposal.id, proposal.version);
  await recordAudit(tx, {
    actorId: actor.id,
    action: "proposal.revised",
    subjectType: "proposal",
    subjectId: proposal.id,
    before: latest ? { revision: latest.number, physicsHash: latest.physicsHash } : null,
    after: { revision: number, physicsHash: facts.physicsHash, checksPassing: facts.checksPassing, ...auditExtra },
  });
  return { revision: number, version: proposal.version + 1, revisionId: row.id };
}

export async function editProposalText(actor: SessionUser, input: EditTextInput): Promise<{ version: number }> {
  const result = await db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    enforce(decideRevise(actor, proposal));
    await bump(tx, proposal.id, proposal.version, { title: input.title, rationale: input.rationale });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "proposal.text-edited",
      subjectType: "proposal",
      subjectId: proposal.id,
      before: { title: proposal.title, rationale: proposal.rationale },
      after: { title: input.title, rationale: input.rationale },
    });
    return { version: proposal.version + 1 };
  });
  await storeMarkdownHtml(input.rationale);
  return result;
}

export async function moveProposal(actor: SessionUser, input: MoveInput, opts: { viaRelease?: boolean; tx?: Tx } = {}): Promise<{ version: number }> {
  const run = async (tx: Tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const facts = await loadProposalFacts(tx, proposal);
    enforce(decideMove(actor, facts, input.to, { reason: input.reason, viaRelease: opts.viaRelease }));
    await bump(tx, proposal.id, proposal.version, {
      stage: input.to,
      stageChangedAt: new Date(),
      ...(input.to === "revision" ? { revisionWhenReturned: facts.latestRevision } : {}),
    });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "proposal.moved",
      subjectType: "proposal",
      subjectId: proposal.id,
      before: { stage: proposal.stage },
      after: { stage: input.to, reason: input.reason ?? null, ...(facts.checksWaived && input.to === "accepted" ? { checksWaived: true } : {}) },
    });
    return { version: proposal.version + 1, from: proposal.stage };
  };
  if (opts.tx) return run(opts.tx);
  const result = await db.transaction(run);
  const latest = await getLatestRevision(db, input.proposalId);
  await notifyMove(input.proposalId, result.from, input.to, latest?.number ?? 0, input.reason);
  return { version: result.version };
}

export async function assignReviewer(actor: SessionUser, input: AssignInput): Promise<{ version: number }> {
  const result = await db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const facts = await loadProposalFacts(tx, proposal);
    const reviewer = await getUserRoles(tx, input.reviewerId);
    if (!reviewer || !reviewer.active) throw new AppError("not-found:user", "That reviewer does not exist or is deactivated.");
    enforce(decideAssignReviewer(actor, facts, reviewer));
    if (facts.assignedReviewerIds.includes(reviewer.id)) throw new AppError("conflict:assigned", "That reviewer is already assigned.");
    await tx.insert(reviewerAssignments).values({ proposalId: proposal.id, reviewerId: reviewer.id, assignedBy: actor.id });
    await bump(tx, proposal.id, proposal.version);
    await recordAudit(tx, { actorId: actor.id, action: "proposal.reviewer-assigned", subjectType: "proposal", subjectId: proposal.id, after: { reviewerId: reviewer.id } });
    return { version: proposal.version + 1 };
  });
  await notifyReviewerAssigned(input.proposalId, input.reviewerId, actor.name);
  return result;
}

export async function unassignReviewer(actor: SessionUser, input: AssignInput): Promise<{ version: number }> {
  return db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const facts = await loadProposalFacts(tx, proposal);
    if (!facts.assignedReviewerIds.includes(input.reviewerId)) throw new AppError("not-found:assignment", "That reviewer is not assigned.");
    enforce(decideManageReviewers(actor, facts));
    await tx.delete(reviewerAssignments).where(and(eq(reviewerAssignments.proposalId, proposal.id), eq(reviewerAssignments.reviewerId, input.reviewerId)));
    await bump(tx, proposal.id, proposal.version);
    await recordAudit(tx, { actorId: actor.id, action: "proposal.reviewer-unassigned", subjectType: "proposal", subjectId: proposal.id, before: { reviewerId: input.reviewerId } });
    return { version: proposal.version + 1 };
  });
}

export async function waiveChecks(actor: SessionUser, input: WaiveInput): Promise<{ version: number }> {
  return db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const facts = await loadProposalFacts(tx, proposal);
    enforce(decideWaiveChecks(actor, facts, input.reason));
    const latest = await getLatestRevision(tx, proposal.id);
    await tx.update(revisions).set({ checksWaivedReason: input.reason, checksWaivedBy: actor.id }).where(eq(revisions.id, latest!.id));
    await bump(tx, proposal.id, proposal.version);
    await recordAudit(tx, {
      actorId: actor.id,
      action: "proposal.checks-waived",
      subjectType: "proposal",
      subjectId: proposal.id,
      after: { revision: latest!.number, reason: input.reason, failing: latest!.checkResults.filter((c) => (c as { status: string }).status === "fail").length },
    });
    return { version: proposal.version + 1 };
  });
}

/** An assigned reviewer (never the author) gives a verdict on the latest revision while the proposal is under review. */
export async function giveVerdict(actor: SessionUser, input: VerdictInput): Promise<{ verdictId: string }> {
  if (!hasAnyRole(actor.roles, ["reviewer"])) throw new AppError("forbidden:role", "Only reviewers give verdicts.");
  const result = await db.transaction(async (tx) => {
    const proposal = await lockProposal(tx, input.proposalId);
    if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
    const facts = await loadProposalFacts(tx, proposal);
    if (actor.id === proposal.authorId) throw new AppError("forbidden:own-proposal", "Nobody may review their own proposal.");
    if (!facts.assignedReviewerIds.includes(actor.id)) throw new AppError("forbidden:not-assigned", "Only reviewers assigned to this proposal give verdicts.");
    if (proposal.stage !== "under_review") throw new AppError("refused:stage", "Verdicts are given while a proposal is under review.");
    const latest = await getLatestRevision(tx, proposal.id);
    const [row] = await tx
      .insert(verdicts)
      .values({ proposalId: proposal.id, revisionId: latest!.id, reviewerId: actor.id, verdict: input.verdict, summary: input.summary, physicsHash: latest!.physicsHash })
      .returning({ id: verdicts.id });
    await tx.update(proposals).set({ updatedAt: new Date(), version: proposal.version + 1 }).where(eq(proposals.id, proposal.id));
    await recordAudit(tx, { actorId: actor.id, action: "proposal.verdict", subjectType: "proposal", subjectId: proposal.id, after: { verdict: input.verdict, revision: latest!.number } });
    return { verdictId: row.id };
  });
  await storeMarkdownHtml(input.summary);
  await notifyVerdict(input.proposalId, actor.name, input.verdict);
  return result;
}
