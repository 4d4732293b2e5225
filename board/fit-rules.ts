import { hasAnyRole } from "@/lib/auth/roles";
import type { ErrorCode } from "@/lib/errors";
import { decideRevise, isFamilyCurator, type ProposalFacts, type RuleActor } from "./rules";

export type FitDecision = { allowed: true } | { allowed: false; code: ErrorCode; reasons: string[] };

/**
 * Who may do what with refits. Pure, like rules.ts: the fit service enforces these, the pages only mirror them.
 * A fit's result becomes a revision, so starting one and saving its result follow the revision rule.
 */
export const ACTIVE_FITS_PER_PERSON = 4;

type FitFacts = Pick<ProposalFacts, "stage" | "authorId" | "familyCuratorIds" | "assignedReviewerIds">;

export function decideStartFit(actor: RuleActor, facts: FitFacts, activeFitsOfActor: number): FitDecision {
  const revise = decideRevise(actor, facts);
  if (!revise.allowed) {
    return { ...revise, reasons: revise.reasons.map((r) => r.replace("save revisions", "start a refit (its result becomes a revision)")) };
  }
  if (activeFitsOfActor >= ACTIVE_FITS_PER_PERSON) {
    return { allowed: false, code: "refused:busy", reasons: [`You already have ${activeFitsOfActor} refits waiting or running; at most ${ACTIVE_FITS_PER_PERSON} at a time. Cancel one or wait for it to finish.`] };
  }
  return { allowed: true };
}

/**
 * Re-running a stored fit checks that it reproduces; the re-run never becomes a revision, so the people who judge
 * the proposal may do it too: its author, assigned reviewers, the family's curators and admins.
 */
export function decideRerunFit(actor: RuleActor, facts: FitFacts, activeFitsOfActor: number): FitDecision {
  const involved =
    actor.id === facts.authorId || facts.assignedReviewerIds.includes(actor.id) || isFamilyCurator(actor, facts) || hasAnyRole(actor.roles, ["admin"]);
  if (!involved) {
    return { allowed: false, code: "forbidden:fit", reasons: ["Only the author, the assigned reviewers, the family's curators and admins may re-run a stored fit."] };
  }
  if (activeFitsOfActor >= ACTIVE_FITS_PER_PERSON) {
    return { allowed: false, code: "refused:busy", reasons: [`You already have ${activeFitsOfActor} refits waiting or running; at most ${ACTIVE_FITS_PER_PERSON} at a time.`] };
  }
  return { allowed: true };
}

export function decideCancelFit(actor: RuleActor, fit: { startedBy: string; status: string }): FitDecision {
  if (actor.id !== fit.startedBy && !hasAnyRole(actor.roles, ["admin"])) {
    return { allowed: false, code: "forbidden:fit", reasons: ["Only the person who started this refit (or an admin) may cancel it."] };
  }
  if (fit.status !== "queued" && fit.status !== "running") {
    return { allowed: false, code: "refused:finished", reasons: ["This refit has already finished; there is nothing to cancel."] };
  }
  return { allowed: true };
}

/** Saving a finished fit's best point as a revision by hand (when it was not saved automatically). */
export function decideApplyFit(
  actor: RuleActor,
  facts: FitFacts,
  fit: { status: string; hasOutcome: boolean; resultRevision: boolean; rerun: boolean },
): FitDecision {
  const revise = decideRevise(actor, facts);
  if (!revise.allowed) return revise;
  if (fit.rerun) return { allowed: false, code: "refused:rerun", reasons: ["A re-run only checks that a stored fit reproduces; save the original fit's result instead."] };
  if (fit.resultRevision) return { allowed: false, code: "refused:applied", reasons: ["This refit's result is already a revision."] };
  if (!fit.hasOutcome) return { allowed: false, code: "refused:no-result", reasons: ["This refit has no result to save (it failed or was cancelled before its first step)."] };
  return { allowed: true };
}
