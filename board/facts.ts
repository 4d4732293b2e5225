import "server-only";
import type { Tx } from "@/db/client";
import type { Proposal } from "@/db/schema";
import type { AcceptanceCriterionInput } from "@/lib/tb/analysis/acceptance";
import { getAssignedReviewerIds, getBoardCard, getFamilyById, getFamilyCuratorIds, getLatestRevision, getRelease } from "./queries";
import { parseDocument } from "./revision-facts";
import type { ProposalFacts } from "./rules";
import { submissionProblems } from "./submission";

/** Gathers what the rules need to decide about one (locked) proposal. */
export async function loadProposalFacts(tx: Tx, proposal: Proposal): Promise<ProposalFacts & { criteria: AcceptanceCriterionInput[] }> {
  // One connection serves the whole transaction, so these run one after another.
  const family = await getFamilyById(tx, proposal.familyId);
  const curators = await getFamilyCuratorIds(tx, proposal.familyId);
  const reviewers = await getAssignedReviewerIds(tx, proposal.id);
  const latest = await getLatestRevision(tx, proposal.id);
  const card = await getBoardCard(tx, proposal.id);
  const base = proposal.baseReleaseId ? await getRelease(tx, proposal.baseReleaseId) : null;
  const proposed = latest ? parseDocument(latest.document) : null;
  const baseDoc = base ? parseDocument(base.document) : null;
  const problems =
    proposed && proposed.ok ? submissionProblems(baseDoc && baseDoc.ok ? baseDoc.doc : null, proposed.doc) : ["The latest revision is not a valid model document."];
  return {
    stage: proposal.stage,
    authorId: proposal.authorId,
    familyCuratorIds: curators,
    assignedReviewerIds: reviewers,
    latestRevision: latest?.number ?? 0,
    revisionWhenReturned: proposal.revisionWhenReturned,
    checksRun: Boolean(latest && latest.checkResults.length > 0),
    checksPassing: Boolean(latest?.checksPassing),
    checksWaived: Boolean(latest?.checksWaivedReason),
    freshAccepts: card?.tally.accept ?? 0,
    requiredAccepts: family?.requiredAccepts ?? 2,
    openBlockingRemarks: card?.openBlockingRemarks ?? 0,
    submissionProblems: problems,
    criteria: (family?.acceptanceCriteria ?? []) as AcceptanceCriterionInput[],
  };
}
