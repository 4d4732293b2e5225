import type { BoardCard } from "../card";
import { moveHints, type MoveHint, type ProposalFacts, type RuleActor } from "../rules";

/**
 * The rules' hints for a card, from what the board knows. Only a hint: the server decides with complete facts
 * (submission requirements and revision numbers it checks are not all on the card).
 */
export function factsFromCard(card: BoardCard, curatorIds: readonly string[]): ProposalFacts {
  return {
    stage: card.stage,
    authorId: card.authorId,
    familyCuratorIds: curatorIds,
    assignedReviewerIds: card.reviewers.map((r) => r.id),
    latestRevision: card.revision,
    // The card does not carry it; assume a new revision exists and let the server decide.
    revisionWhenReturned: card.stage === "revision" ? card.revision - 1 : null,
    checksRun: card.revision > 0,
    checksPassing: card.checksPassing,
    checksWaived: card.checksWaived,
    freshAccepts: card.tally.accept,
    requiredAccepts: card.requiredAccepts,
    openBlockingRemarks: card.openBlockingRemarks,
    submissionProblems: [],
  };
}

export function hintsForCard(viewer: RuleActor, card: BoardCard, curatorsByFamily: Record<string, readonly string[]>): MoveHint[] {
  return moveHints(viewer, factsFromCard(card, curatorsByFamily[card.familySlug] ?? []));
}
