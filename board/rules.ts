import type { Role } from "@/lib/auth/roles";
import { STAGE_META, type Stage } from "./stages";

/**
 * The review rules: who may move a proposal from which stage to which, and the gates a move must pass.
 * Pure: the server calls it for every move, whichever client asks; the UI calls it only for hints.
 */
export interface RuleActor {
  id: string;
  roles: readonly Role[];
}

export interface ProposalFacts {
  stage: Stage;
  authorId: string;
  /** Curators of the proposal's family (people holding the curator role who own this family). */
  familyCuratorIds: readonly string[];
  assignedReviewerIds: readonly string[];
  latestRevision: number;
  /** Revision number current when the proposal was last sent back for revision; null if never. */
  revisionWhenReturned: number | null;
  checksRun: boolean;
  checksPassing: boolean;
  /** A curator waived the failing checks of the latest revision, with a written reason. */
  checksWaived: boolean;
  /** Accept verdicts on the current physics from assigned reviewers who are not the author. */
  freshAccepts: number;
  requiredAccepts: number;
  openBlockingRemarks: number;
  /** What the submission form still lacks (provenance, citations); empty when complete. */
  submissionProblems: readonly string[];
}

export interface MoveOptions {
  reason?: string;
  /** Only the release use-case may move a proposal to released. */
  viaRelease?: boolean;
}

export type RefusalCode = "forbidden:move" | "invalid:transition" | "refused:gate";
export type MoveDecision = { allowed: true } | { allowed: false; code: RefusalCode; reasons: string[] };

type Who = "author" | "curator";
interface Transition {
  who: Who;
  needsReason?: boolean;
  gate?: (f: ProposalFacts) => string[];
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

const submitGate = (f: ProposalFacts) => [
  ...(f.checksRun ? [] : ["The checks have not run on the latest revision yet; save the draft first."]),
  ...f.submissionProblems,
];

const startReviewGate = (f: ProposalFacts) => [
  ...(f.assignedReviewerIds.length === 0 ? ["Assign at least one reviewer first."] : []),
  ...(f.assignedReviewerIds.includes(f.authorId) ? ["The author cannot review their own proposal; unassign them."] : []),
];

const acceptGate = (f: ProposalFacts) => [
  ...(f.freshAccepts < f.requiredAccepts
    ? [`Needs ${plural(f.requiredAccepts, "fresh accept verdict")} from assigned reviewers; has ${f.freshAccepts}.`]
    : []),
  ...(f.openBlockingRemarks > 0 ? [`${plural(f.openBlockingRemarks, "blocking remark")} still open.`] : []),
  ...(!f.checksRun ? ["The checks have not run on the latest revision."] : []),
  ...(f.checksRun && !f.checksPassing && !f.checksWaived ? ["Some checks fail and no curator has waived them."] : []),
];

/** What still stands between the proposal and acceptance, whoever asks (shown on the review page). */
export function acceptanceBlockers(f: ProposalFacts): string[] {
  return acceptGate(f);
}

const resubmitGate = (f: ProposalFacts) =>
  f.revisionWhenReturned === null
    ? ["It is not known which revision was sent back, so a new revision cannot be recognised; ask a curator."]
    : f.latestRevision <= f.revisionWhenReturned
      ? [`Save a new revision first: it is still revision ${f.latestRevision}, as when it was sent back.`]
      : [];

const TRANSITIONS: Partial<Record<Stage, Partial<Record<Stage, Transition>>>> = {
  draft: {
    submitted: { who: "author", gate: submitGate },
    withdrawn: { who: "author" },
  },
  submitted: {
    draft: { who: "author" },
    under_review: { who: "curator", gate: startReviewGate },
    declined: { who: "curator", needsReason: true },
    withdrawn: { who: "author" },
  },
  under_review: {
    revision: { who: "curator", needsReason: true },
    accepted: { who: "curator", gate: acceptGate },
    declined: { who: "curator", needsReason: true },
    withdrawn: { who: "author" },
  },
  revision: {
    under_review: { who: "author", gate: resubmitGate },
    declined: { who: "curator", needsReason: true },
    withdrawn: { who: "author" },
  },
  accepted: {
    released: { who: "curator" },
  },
};

export function isFamilyCurator(actor: RuleActor, facts: Pick<ProposalFacts, "familyCuratorIds">): boolean {
  return actor.roles.includes("curator") && facts.familyCuratorIds.includes(actor.id);
}

function mayAct(who: Who, actor: RuleActor, facts: ProposalFacts): string | null {
  if (who === "author") return actor.id === facts.authorId ? null : "Only the proposal's author may make this move.";
  if (!isFamilyCurator(actor, facts)) return "Only a curator of this model family may make this move.";
  if (actor.id === facts.authorId) return "A curator cannot rule on their own proposal; another curator of the family must.";
  return null;
}

export function decideMove(actor: RuleActor, facts: ProposalFacts, to: Stage, opts: MoveOptions = {}): MoveDecision {
  const transition = TRANSITIONS[facts.stage]?.[to];
  if (!transition) {
    return { allowed: false, code: "invalid:transition", reasons: [`A proposal cannot move from ${STAGE_META[facts.stage].label} to ${STAGE_META[to].label}.`] };
  }
  const who = mayAct(transition.who, actor, facts);
  if (who) return { allowed: false, code: "forbidden:move", reasons: [who] };
  if (to === "released" && !opts.viaRelease) {
    return { allowed: false, code: "invalid:transition", reasons: ["Release an accepted proposal from its release form, which fixes version and changelog."] };
  }
  const reasons = [...(transition.needsReason && !opts.reason?.trim() ? ["Give a reason for this move."] : []), ...(transition.gate?.(facts) ?? [])];
  return reasons.length ? { allowed: false, code: "refused:gate", reasons } : { allowed: true };
}

export interface MoveHint {
  to: Stage;
  /** Allowed now, given a reason where one is needed. */
  allowed: boolean;
  needsReason: boolean;
  reasons: string[];
}

/**
 * The moves this person could make from the current stage, with the gates' verdicts, for the board's hints and
 * "move to…" menu. A move the person may never make (wrong role) is left out.
 */
export function moveHints(actor: RuleActor, facts: ProposalFacts): MoveHint[] {
  const out: MoveHint[] = [];
  for (const [to, transition] of Object.entries(TRANSITIONS[facts.stage] ?? {}) as [Stage, Transition][]) {
    if (to === "released" || mayAct(transition.who, actor, facts)) continue;
    const reasons = transition.gate?.(facts) ?? [];
    out.push({ to, allowed: reasons.length === 0, needsReason: Boolean(transition.needsReason), reasons });
  }
  return out;
}

/** Who may change the reviewer list: a curator of the family, while the proposal is submitted, under review or in revision. */
export function decideManageReviewers(actor: RuleActor, facts: ProposalFacts): MoveDecision {
  if (!isFamilyCurator(actor, facts)) return { allowed: false, code: "forbidden:move", reasons: ["Only a curator of this model family may assign reviewers."] };
  if (actor.id === facts.authorId) return { allowed: false, code: "forbidden:move", reasons: ["A curator cannot choose the reviewers of their own proposal."] };
  if (!["submitted", "under_review", "revision"].includes(facts.stage)) {
    return { allowed: false, code: "invalid:transition", reasons: [`Reviewers cannot be changed while the proposal is ${STAGE_META[facts.stage].label.toLowerCase()}.`] };
  }
  return { allowed: true };
}

/** Assigning additionally needs a reviewer who holds the role and is not the author. */
export function decideAssignReviewer(actor: RuleActor, facts: ProposalFacts, reviewer: { id: string; roles: readonly Role[] }): MoveDecision {
  const manage = decideManageReviewers(actor, facts);
  if (!manage.allowed) return manage;
  if (reviewer.id === facts.authorId) return { allowed: false, code: "refused:gate", reasons: ["Nobody may review their own proposal."] };
  if (!reviewer.roles.includes("reviewer")) return { allowed: false, code: "refused:gate", reasons: ["That person does not hold the reviewer role."] };
  return { allowed: true };
}

/** Who may save a new revision: the author, while the proposal is a draft or back for revision. */
export function decideRevise(actor: RuleActor, facts: Pick<ProposalFacts, "stage" | "authorId">): MoveDecision {
  if (actor.id !== facts.authorId) return { allowed: false, code: "forbidden:move", reasons: ["Only the proposal's author may save revisions."] };
  if (facts.stage !== "draft" && facts.stage !== "revision") {
    return { allowed: false, code: "invalid:transition", reasons: [`A ${STAGE_META[facts.stage].label.toLowerCase()} proposal cannot be edited; it must be in draft or revision.`] };
  }
  return { allowed: true };
}

/** A curator of the family may waive failing checks of the latest revision, with a written reason. */
export function decideWaiveChecks(actor: RuleActor, facts: ProposalFacts, reason: string): MoveDecision {
  if (!isFamilyCurator(actor, facts)) return { allowed: false, code: "forbidden:move", reasons: ["Only a curator of this model family may waive checks."] };
  if (actor.id === facts.authorId) return { allowed: false, code: "forbidden:move", reasons: ["A curator cannot waive checks on their own proposal."] };
  if (!facts.checksRun || facts.checksPassing) return { allowed: false, code: "refused:gate", reasons: ["There are no failing checks to waive."] };
  if (reason.trim().length < 10) return { allowed: false, code: "refused:gate", reasons: ["Write why the failing checks may be waived (at least 10 characters)."] };
  return { allowed: true };
}
