import { describe, expect, it } from "vitest";
import { decideMove, type MoveDecision, type MoveOptions, type ProposalFacts } from "@/board/rules";
import type { Stage } from "@/board/stages";
import { openFacts } from "./helpers/facts";
import { IDS, person } from "./helpers/people";

const author = person(IDS.author, "author");
const curator = person(IDS.familyCurator, "curator");

function refusal(d: MoveDecision): string[] {
  if (d.allowed) throw new Error("expected a refusal, got allowed");
  expect(d.code).toBe("refused:gate");
  return d.reasons;
}

/** The person the table names for each gated move used here: the author for submit and resubmit, else a family curator. */
const AUTHOR_MOVES = new Set(["draft→submitted", "revision→under_review"]);
const decide = (stage: Stage, to: Stage, facts: Partial<ProposalFacts>, opts: MoveOptions = {}) =>
  decideMove(AUTHOR_MOVES.has(`${stage}→${to}`) ? author : curator, openFacts(stage, facts), to, opts);

describe("draft → submitted", () => {
  it("passes with checks run and no submission problems", () => {
    expect(decide("draft", "submitted", {})).toEqual({ allowed: true });
  });
  it("refuses when the checks have not run", () => {
    expect(refusal(decide("draft", "submitted", { checksRun: false }))).toHaveLength(1);
  });
  it("lists every submission problem, verbatim", () => {
    const problems = ["Provenance: k-mesh is missing.", "Validity range: give at least one.", "Citation missing for x."];
    expect(refusal(decide("draft", "submitted", { submissionProblems: problems }))).toEqual(expect.arrayContaining(problems));
    expect(refusal(decide("draft", "submitted", { submissionProblems: problems }))).toHaveLength(3);
  });
  it("lists the checks and all problems together", () => {
    const reasons = refusal(decide("draft", "submitted", { checksRun: false, submissionProblems: ["a problem", "another"] }));
    expect(reasons).toHaveLength(3);
    expect(reasons).toEqual(expect.arrayContaining(["a problem", "another"]));
  });
  it("does not look at failing checks, accepts or remarks (only that checks ran)", () => {
    expect(decide("draft", "submitted", { checksPassing: false, freshAccepts: 0, openBlockingRemarks: 4 })).toEqual({ allowed: true });
  });
});

describe("submitted → under_review", () => {
  it("passes with one assigned reviewer who is not the author", () => {
    expect(decide("submitted", "under_review", { assignedReviewerIds: [IDS.assignedReviewer] })).toEqual({ allowed: true });
  });
  it("refuses with no reviewer assigned", () => {
    expect(refusal(decide("submitted", "under_review", { assignedReviewerIds: [] }))).toHaveLength(1);
  });
  it("refuses when the author is among the reviewers, even beside others", () => {
    expect(refusal(decide("submitted", "under_review", { assignedReviewerIds: [IDS.author] }))).toHaveLength(1);
    expect(refusal(decide("submitted", "under_review", { assignedReviewerIds: [IDS.assignedReviewer, IDS.author] }))).toHaveLength(1);
  });
  it("gives different reasons for the two failures", () => {
    const none = refusal(decide("submitted", "under_review", { assignedReviewerIds: [] }));
    const self = refusal(decide("submitted", "under_review", { assignedReviewerIds: [IDS.author] }));
    expect(none[0]).not.toBe(self[0]);
  });
});

describe("moves that need a reason", () => {
  const REASONED: [Stage, Stage][] = [["submitted", "declined"], ["under_review", "revision"], ["under_review", "declined"], ["revision", "declined"]];

  it.each(REASONED)("%s → %s refuses a missing, empty or whitespace reason and accepts a real one", (from, to) => {
    for (const reason of [undefined, "", " ", "   \t\n  "]) {
      expect(refusal(decide(from, to, {}, { reason })), JSON.stringify(reason)).toHaveLength(1);
    }
    for (const reason of ["x", "  out of the family's scope  ", "needs the d shell"]) {
      expect(decide(from, to, {}, { reason }), reason).toEqual({ allowed: true });
    }
  });

  it.each(REASONED)("%s → %s needs no other gate (failing checks, missing accepts do not matter)", (from, to) => {
    const bad = { checksRun: false, checksPassing: false, freshAccepts: 0, openBlockingRemarks: 3, assignedReviewerIds: [] };
    expect(decide(from, to, bad, { reason: "a reason" })).toEqual({ allowed: true });
  });
});

describe("under_review → accepted", () => {
  const accept = (facts: Partial<ProposalFacts>) => decide("under_review", "accepted", facts);

  it("fresh accepts: required − 1 refuses, = required and above pass", () => {
    expect(refusal(accept({ freshAccepts: 1, requiredAccepts: 2 }))).toHaveLength(1);
    expect(accept({ freshAccepts: 2, requiredAccepts: 2 })).toEqual({ allowed: true });
    expect(accept({ freshAccepts: 3, requiredAccepts: 2 })).toEqual({ allowed: true });
    expect(refusal(accept({ freshAccepts: 0, requiredAccepts: 1 }))).toHaveLength(1);
    expect(accept({ freshAccepts: 1, requiredAccepts: 1 })).toEqual({ allowed: true });
    expect(accept({ freshAccepts: 0, requiredAccepts: 0 })).toEqual({ allowed: true });
  });
  it("open blocking remarks: 1 refuses, 0 passes", () => {
    expect(refusal(accept({ openBlockingRemarks: 1 }))).toHaveLength(1);
    expect(refusal(accept({ openBlockingRemarks: 5 }))).toHaveLength(1);
  });
  it("checks not run refuses, even when marked passing or waived", () => {
    expect(refusal(accept({ checksRun: false }))).toHaveLength(1);
    expect(refusal(accept({ checksRun: false, checksPassing: true, checksWaived: true }))).toHaveLength(1);
  });
  it("failing checks refuse unless waived", () => {
    expect(refusal(accept({ checksPassing: false }))).toHaveLength(1);
    expect(accept({ checksPassing: false, checksWaived: true })).toEqual({ allowed: true });
    expect(accept({ checksPassing: true, checksWaived: true })).toEqual({ allowed: true });
  });
  it("lists every failing reason, not just the first", () => {
    const withRunChecks = refusal(accept({ freshAccepts: 0, requiredAccepts: 2, openBlockingRemarks: 1, checksPassing: false }));
    expect(withRunChecks).toHaveLength(3);
    expect(new Set(withRunChecks).size).toBe(3);
    const withoutChecks = refusal(accept({ freshAccepts: 1, requiredAccepts: 2, openBlockingRemarks: 2, checksRun: false }));
    expect(withoutChecks).toHaveLength(3);
    expect(refusal(accept({ freshAccepts: 1, openBlockingRemarks: 1 }))).toHaveLength(2);
    expect(refusal(accept({ openBlockingRemarks: 1, checksPassing: false }))).toHaveLength(2);
  });
});

describe("revision → under_review (the author resubmits)", () => {
  const resubmit = (latestRevision: number, revisionWhenReturned: number) => decide("revision", "under_review", { latestRevision, revisionWhenReturned });

  it("refuses while the revision number equals the one sent back", () => {
    expect(refusal(resubmit(2, 2))).toHaveLength(1);
    expect(refusal(resubmit(1, 1))).toHaveLength(1);
  });
  it("passes once a later revision exists", () => {
    expect(resubmit(3, 2)).toEqual({ allowed: true });
    expect(resubmit(7, 2)).toEqual({ allowed: true });
  });
  it("refuses a revision number below the one sent back", () => {
    expect(refusal(resubmit(1, 2))).toHaveLength(1);
  });
  it("needs no assigned reviewers, accepts or passing checks", () => {
    expect(decide("revision", "under_review", { assignedReviewerIds: [], checksRun: false, freshAccepts: 0 })).toEqual({ allowed: true });
  });
});

describe("accepted → released", () => {
  it("only through the release use-case", () => {
    expect(decideMove(curator, openFacts("accepted"), "released", { viaRelease: true })).toEqual({ allowed: true });
    for (const opts of [{}, { viaRelease: false }, { reason: "ship it" }]) {
      const d = decideMove(curator, openFacts("accepted"), "released", opts);
      expect(d.allowed, JSON.stringify(opts)).toBe(false);
    }
  });
  it("the wrong person is forbidden even via the release use-case", () => {
    for (const actor of [author, person(IDS.nonFamilyCurator, "curator"), person(IDS.stranger, "admin")]) {
      expect(decideMove(actor, openFacts("accepted"), "released", { viaRelease: true })).toMatchObject({ allowed: false, code: "forbidden:move" });
    }
  });
});

describe("moves without a gate", () => {
  it.each([["draft", "withdrawn"], ["submitted", "draft"], ["submitted", "withdrawn"], ["under_review", "withdrawn"], ["revision", "withdrawn"]] as [Stage, Stage][])(
    "%s → %s is allowed for the author whatever the facts",
    (from, to) => {
      const bad = { checksRun: false, submissionProblems: ["x"], assignedReviewerIds: [], freshAccepts: 0, openBlockingRemarks: 9, latestRevision: 1, revisionWhenReturned: 1 };
      expect(decideMove(author, openFacts(from, bad), to)).toEqual({ allowed: true });
    },
  );
});
