import "server-only";
import { asc, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { modelFamilies, proposals, releases, reviewerAssignments, revisions, users, verdicts } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import type { CheckResult } from "@/lib/tb/analysis/check-result";
import { loadProposalFacts } from "./facts";
import { decideRerunFit, decideStartFit } from "./fit-rules";
import { getBoardCard, listReferenceSets } from "./queries";
import { parseDocument } from "./revision-facts";
import { decideManageReviewers, decideRevise, decideWaiveChecks, isFamilyCurator, moveHints, type MoveHint, type ProposalFacts } from "./rules";

/** Everything the proposal page shows, with what this viewer may do there (the server re-checks every action). */
export async function getProposalView(proposalId: string, viewer: SessionUser) {
  const [proposal] = await db
    .select({ p: proposals, familySlug: modelFamilies.slug, familyTitle: modelFamilies.title, authorName: users.name, baseVersion: releases.version, baseDocument: releases.document })
    .from(proposals)
    .innerJoin(modelFamilies, eq(modelFamilies.id, proposals.familyId))
    .innerJoin(users, eq(users.id, proposals.authorId))
    .leftJoin(releases, eq(releases.id, proposals.baseReleaseId))
    .where(eq(proposals.id, proposalId));
  if (!proposal) return null;
  const { criteria, ...facts }: ProposalFacts & { criteria: unknown[] } = await db.transaction((tx) => loadProposalFacts(tx, proposal.p));
  const [revisionRows, reviewerRows, verdictRows, references, card] = await Promise.all([
    db.select().from(revisions).where(eq(revisions.proposalId, proposalId)).orderBy(desc(revisions.number)),
    db
      .select({ id: users.id, name: users.name })
      .from(reviewerAssignments)
      .innerJoin(users, eq(users.id, reviewerAssignments.reviewerId))
      .where(eq(reviewerAssignments.proposalId, proposalId))
      .orderBy(asc(users.name)),
    db
      .select({ id: verdicts.id, verdict: verdicts.verdict, summary: verdicts.summary, physicsHash: verdicts.physicsHash, createdAt: verdicts.createdAt, reviewerName: users.name, reviewerId: verdicts.reviewerId, revisionId: verdicts.revisionId })
      .from(verdicts)
      .innerJoin(users, eq(users.id, verdicts.reviewerId))
      .where(eq(verdicts.proposalId, proposalId))
      .orderBy(desc(verdicts.createdAt)),
    listReferenceSets(proposalId),
    getBoardCard(db, proposalId),
  ]);
  const latest = revisionRows[0] ?? null;
  const latestDoc = latest ? parseDocument(latest.document) : null;
  const baseDoc = proposal.baseDocument ? parseDocument(proposal.baseDocument) : null;
  const revisionNumber = new Map(revisionRows.map((r) => [r.id, r.number]));
  const can = (d: { allowed: boolean }) => d.allowed;
  return {
    proposal: proposal.p,
    familySlug: proposal.familySlug,
    familyTitle: proposal.familyTitle,
    authorName: proposal.authorName,
    baseVersion: proposal.baseVersion,
    baseDocument: baseDoc && baseDoc.ok ? baseDoc.doc : null,
    latest: latest && { ...latest, checkResults: latest.checkResults as CheckResult[] },
    latestDocument: latestDoc && latestDoc.ok ? latestDoc.doc : null,
    revisions: revisionRows.map(({ document: _document, ...r }) => r),
    reviewers: reviewerRows,
    verdicts: verdictRows.map((v) => ({ ...v, revision: revisionNumber.get(v.revisionId) ?? 0, fresh: latest !== null && v.physicsHash === latest.physicsHash })),
    references,
    card,
    facts,
    criteria,
    hints: moveHints(viewer, facts) as MoveHint[],
    may: {
      revise: can(decideRevise(viewer, facts)),
      manageReviewers: can(decideManageReviewers(viewer, facts)),
      waive: facts.checksRun && !facts.checksPassing && !facts.checksWaived && can(decideWaiveChecks(viewer, facts, "x".repeat(10))),
      giveVerdict: facts.stage === "under_review" && facts.assignedReviewerIds.includes(viewer.id) && viewer.id !== facts.authorId,
      curate: isFamilyCurator(viewer, facts),
      startFit: can(decideStartFit(viewer, facts, 0)),
      rerunFit: can(decideRerunFit(viewer, facts, 0)),
    },
  };
}

export type ProposalView = NonNullable<Awaited<ReturnType<typeof getProposalView>>>;
