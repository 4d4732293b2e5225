import "server-only";
import { and, eq } from "drizzle-orm";
import { blankModelDocument } from "@/lib/tb/blank-document";
import { db, type Tx } from "@/db/client";
import { proposals, reviewerAssignments, revisions, verdicts } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { hasAnyRole } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError, type ErrorCode } from "@/lib/errors";
import type { AcceptanceCriterionInput } from "@/lib/tb/analysis/acceptance";
import type { ModelDocument } from "@/lib/tb/document";
import { loadProposalFacts } from "./facts";
import { notifyMove, notifyReviewerAssigned, notifyVerdict } from "./notify";
import { storeMarkdownHtml } from "./markdown-html";
import { getBoardCard, findFamilyBySlug, getLatestRevision, getRelease, getUserRoles, lockProposal } from "./queries";
import { deriveRevisionFacts, parseDocument } from "./revision-facts";
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

function invalidDocument(issues: { path: string; message: string }[]): AppError {
  const fieldErrors: Record<string, string[]> = {};
  for (const i of issues) (fieldErrors[i.path || "document"] ??= []).push(i.message);
  return new AppError("invalid:document", `The model document has ${issues.length} problem${issues.length === 1 ? "" : "s"}: ${issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join("; ")}${issues.length > 3 ? "; …" : ""}`, fieldErrors, { issues });
}

async function baseDocumentOf(tx: Tx, baseReleaseId: string | null): Promise<ModelDocument | null> {
  if (!baseReleaseId) return null;
  const release = await getRelease(tx, baseReleaseId);
  const parsed = release ? parseDocument(release.document) : null;
  return parsed && parsed.ok ? parsed.doc : null;
}

export async function createProposal(actor: SessionUser, input: CreateProposalInput, document?: unknown): Promise<{ proposalId: string }> {
  if (!hasAnyRole(actor.roles, ["author"])) throw new AppError("forbidden:role", "Only authors may start proposals.");
  const result = await db.transaction(async (tx) => {
    const family = await findFamilyBySlug(tx, input.familySlug);
    if (!family) throw new AppError("not-found:family", "That model family does not exist.", { familySlug: ["Unknown family."] });
    const base = input.baseReleaseId ? await getRelease(tx, input.baseReleaseId) : null;
    if (input.baseReleaseId && (!base || base.familyId !== family.id)) {
      throw new AppError("invalid:base", "The base release does not belong to this family.", { baseReleaseId: ["Not a release of this family."] });
    }
    const raw = document ?? base?.document ?? blankModelDocument(family.dimension as 1 | 2 | 3);
    const parsed = parseDocument(raw);
    if (!parsed.ok) throw invalidDocument(parsed.issues);
    const baseDoc = await baseDocumentOf(tx, base?.id ?? null);
    const facts = deriveRevisionFacts(parsed.doc, baseDoc, family.acceptanceCriteria as AcceptanceCriterionInput[]);
    const [proposal] = await tx
      .insert(proposals)
      .values({ familyId: family.id, baseReleaseId: base?.id ?? null, authorId: actor.id, title: input.title, rationale: input.rationale })
      .returning({ id: proposals.id });
    await tx.insert(revisions).values({ proposalId: proposal.id, number: 1, document: parsed.doc, note: "first revision", createdBy: actor.id, ...facts });
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
  const parsed = parseDocument(input.document);
  if (!parsed.ok) throw invalidDocument(parsed.issues);
  return db.transaction(async (tx) => {
    const proposal = await lockFresh(tx, input.proposalId, input.version);
    const { revision, version } = await appendRevision(tx, actor, proposal, parsed.doc, input.note);
    return { revision, version };
  });
}

type LockedProposal = NonNullable<Awaited<ReturnType<typeof lockProposal>>>;

/**
 * Adds the next revision to a proposal the caller has locked (rules, checks, audit, version bump). Shared by the
 * editor's save and by a refit's result.
 */
export async function appendRevision(
  tx: Tx,
  actor: RuleActorLike,
  proposal: LockedProposal,
  doc: ModelDocument,
  note: string,
  auditExtra: Record<string, unknown> = {},
): Promise<{ revision: number; version: number; revisionId: string }> {
  enforce(decideRevise(actor, proposal));
  const latest = await getLatestRevision(tx, proposal.id);
  const family = await loadProposalFacts(tx, proposal);
  const facts = deriveRevisionFacts(doc, await baseDocumentOf(tx, proposal.baseReleaseId), family.criteria);
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
