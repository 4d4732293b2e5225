import type { ProposalFacts } from "@/board/rules";
import type { Stage } from "@/board/stages";
import { IDS, type Position } from "./people";

/** Every gate in the table holds: checks ran and pass, enough fresh accepts, nothing blocking, a new revision saved. */
export function openFacts(stage: Stage, overrides: Partial<ProposalFacts> = {}): ProposalFacts {
  return {
    stage,
    authorId: IDS.author,
    familyCuratorIds: [IDS.familyCurator, IDS.otherFamilyCurator],
    assignedReviewerIds: [IDS.assignedReviewer, IDS.otherReviewer],
    latestRevision: 3,
    revisionWhenReturned: 2,
    checksRun: true,
    checksPassing: true,
    checksWaived: false,
    freshAccepts: 2,
    requiredAccepts: 2,
    openBlockingRemarks: 0,
    submissionProblems: [],
    ...overrides,
  };
}

/**
 * Every gate fails at once: checks never ran, two submission problems, the author assigned as a reviewer, one accept
 * short, two blocking remarks, no revision saved since the proposal was sent back.
 */
export function closedFacts(stage: Stage, overrides: Partial<ProposalFacts> = {}): ProposalFacts {
  return openFacts(stage, {
    assignedReviewerIds: [IDS.author, IDS.assignedReviewer],
    latestRevision: 2,
    revisionWhenReturned: 2,
    checksRun: false,
    checksPassing: false,
    freshAccepts: 1,
    requiredAccepts: 2,
    openBlockingRemarks: 2,
    submissionProblems: ["Provenance: k-mesh is missing.", "Validity range: give at least one."],
    ...overrides,
  });
}

/** The author-listed position puts the author on the family's curator list as well. */
export function placeActor(facts: ProposalFacts, position: Position): ProposalFacts {
  if (position !== "author-listed") return facts;
  return { ...facts, familyCuratorIds: [...facts.familyCuratorIds, IDS.author] };
}
