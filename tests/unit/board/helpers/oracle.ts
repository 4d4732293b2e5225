import type { MoveOptions, ProposalFacts, RuleActor } from "@/board/rules";
import type { Stage } from "@/board/stages";

/**
 * An independent reading of the specification's move table, written from the table and not from board/rules.ts.
 * Gate failures are returned as labels (one per failing condition), so a test can check that every failing
 * reason is listed without depending on the module's wording.
 */
export const SPEC_STAGES: readonly Stage[] = ["draft", "submitted", "under_review", "revision", "accepted", "released", "declined", "withdrawn"];

type Mover = "author" | "family curator, not the author";
type Gate = (facts: ProposalFacts, opts: MoveOptions) => string[];

interface Row {
  who: Mover;
  gate: Gate;
  /** The move needs a written reason (shown as needsReason in hints). */
  reason: boolean;
}

const none: Gate = () => [];
const reasonGiven: Gate = (_f, o) => (o.reason !== undefined && o.reason.trim() !== "" ? [] : ["reason"]);

const submit: Gate = (f) => [...(f.checksRun ? [] : ["checks-not-run"]), ...f.submissionProblems.map((p) => `problem:${p}`)];
const startReview: Gate = (f) => [
  ...(f.assignedReviewerIds.length >= 1 ? [] : ["no-reviewer"]),
  ...(f.assignedReviewerIds.includes(f.authorId) ? ["author-reviews"] : []),
];
const accept: Gate = (f) => [
  ...(f.freshAccepts >= f.requiredAccepts ? [] : ["accepts"]),
  ...(f.openBlockingRemarks === 0 ? [] : ["blocking"]),
  ...(f.checksRun ? [] : ["checks-not-run"]),
  ...(f.checksRun && !(f.checksPassing || f.checksWaived) ? ["checks-fail"] : []),
];
const resubmit: Gate = (f) => (f.revisionWhenReturned !== null && f.latestRevision > f.revisionWhenReturned ? [] : ["no-new-revision"]);
const viaRelease: Gate = (_f, o) => (o.viaRelease === true ? [] : ["release-only"]);

const author = (gate: Gate = none): Row => ({ who: "author", gate, reason: false });
const curator = (gate: Gate): Row => ({ who: "family curator, not the author", gate, reason: false });
const curatorWithReason: Row = { who: "family curator, not the author", gate: reasonGiven, reason: true };

export const SPEC_TABLE: Partial<Record<Stage, Partial<Record<Stage, Row>>>> = {
  draft: { submitted: author(submit), withdrawn: author() },
  submitted: { draft: author(), under_review: curator(startReview), declined: curatorWithReason, withdrawn: author() },
  under_review: { revision: curatorWithReason, accepted: curator(accept), declined: curatorWithReason, withdrawn: author() },
  revision: { under_review: author(resubmit), declined: curatorWithReason, withdrawn: author() },
  accepted: { released: curator(viaRelease) },
};

export function specRow(from: Stage, to: Stage): Row | undefined {
  return from === to ? undefined : SPEC_TABLE[from]?.[to];
}

export function specFamilyCurator(actor: RuleActor, facts: ProposalFacts): boolean {
  return actor.roles.includes("curator") && facts.familyCuratorIds.includes(actor.id);
}

export function specMayMake(row: Row, actor: RuleActor, facts: ProposalFacts): boolean {
  if (row.who === "author") return actor.id === facts.authorId;
  return specFamilyCurator(actor, facts) && actor.id !== facts.authorId;
}

/**
 * "release-only" is the accepted → released move without viaRelease: the table says "otherwise refused" but not
 * with which code, so a test accepts invalid:transition or refused:gate there.
 */
export type Expected =
  | { kind: "allowed" }
  | { kind: "invalid:transition" }
  | { kind: "forbidden:move" }
  | { kind: "refused:gate"; failing: string[] }
  | { kind: "release-only" };

export function expectedMove(actor: RuleActor, facts: ProposalFacts, to: Stage, opts: MoveOptions): Expected {
  const row = specRow(facts.stage, to);
  if (!row) return { kind: "invalid:transition" };
  if (!specMayMake(row, actor, facts)) return { kind: "forbidden:move" };
  const failing = row.gate(facts, opts);
  if (failing.includes("release-only")) return { kind: "release-only" };
  return failing.length ? { kind: "refused:gate", failing } : { kind: "allowed" };
}

/** Gate failures a hint reports: everything except the missing reason, which the person supplies when moving. */
export function expectedHintFailures(row: Row, facts: ProposalFacts): string[] {
  return row.gate(facts, { reason: "a reason", viaRelease: true });
}
