import { describe, expect, it } from "vitest";
import { ACTIVE_FITS_PER_PERSON, decideApplyFit, decideCancelFit, decideRerunFit, decideStartFit } from "@/board/fit-rules";
import type { Role } from "@/lib/auth/roles";
import { STAGES } from "@/board/stages";

const author = { id: "author", roles: ["author"] as Role[] };
const reviewer = { id: "rev", roles: ["reviewer"] as Role[] };
const curator = { id: "cur", roles: ["curator"] as Role[] };
const admin = { id: "adm", roles: ["admin"] as Role[] };
const stranger = { id: "x", roles: ["author", "reviewer"] as Role[] };
const facts = (stage: (typeof STAGES)[number]) => ({ stage, authorId: "author", familyCuratorIds: ["cur"], assignedReviewerIds: ["rev"] });

describe("who may start a refit", () => {
  it("only the author, only in draft or revision, and at most a few at a time", () => {
    for (const stage of STAGES) {
      expect(decideStartFit(author, facts(stage), 0).allowed).toBe(stage === "draft" || stage === "revision");
      for (const other of [reviewer, curator, admin, stranger]) expect(decideStartFit(other, facts(stage), 0).allowed).toBe(false);
    }
    const busy = decideStartFit(author, facts("draft"), ACTIVE_FITS_PER_PERSON);
    expect(busy).toMatchObject({ allowed: false, code: "refused:busy" });
    expect(decideStartFit(author, facts("draft"), ACTIVE_FITS_PER_PERSON - 1).allowed).toBe(true);
    const reason = decideStartFit(reviewer, facts("draft"), 0);
    expect(reason.allowed ? "" : reason.reasons[0]).toBe("Only the proposal's author may start a refit (its result becomes a revision).");
  });
});

describe("who may re-run a stored fit", () => {
  it("the author, assigned reviewers, the family's curators and admins — in any stage; nobody else", () => {
    for (const stage of STAGES) {
      for (const who of [author, reviewer, curator, admin]) expect(decideRerunFit(who, facts(stage), 0).allowed).toBe(true);
      expect(decideRerunFit(stranger, facts(stage), 0)).toMatchObject({ allowed: false, code: "forbidden:fit" });
    }
    expect(decideRerunFit({ id: "cur2", roles: ["curator"] }, facts("draft"), 0).allowed).toBe(false);
  });
});

describe("cancel and save", () => {
  it("the starter or an admin cancels a waiting or running fit; a finished one has nothing to cancel", () => {
    expect(decideCancelFit(author, { startedBy: "author", status: "running" }).allowed).toBe(true);
    expect(decideCancelFit(admin, { startedBy: "author", status: "queued" }).allowed).toBe(true);
    expect(decideCancelFit(reviewer, { startedBy: "author", status: "running" })).toMatchObject({ allowed: false, code: "forbidden:fit" });
    for (const status of ["converged", "not_converged", "cancelled", "failed"]) {
      expect(decideCancelFit(author, { startedBy: "author", status })).toMatchObject({ allowed: false, code: "refused:finished" });
    }
  });

  it("the author saves a result once, never a re-run's, never one without a result, only while revisions are allowed", () => {
    const fit = { status: "not_converged", hasOutcome: true, resultRevision: false, rerun: false };
    expect(decideApplyFit(author, facts("draft"), fit).allowed).toBe(true);
    expect(decideApplyFit(author, facts("submitted"), fit).allowed).toBe(false);
    expect(decideApplyFit(reviewer, facts("draft"), fit).allowed).toBe(false);
    expect(decideApplyFit(author, facts("draft"), { ...fit, resultRevision: true })).toMatchObject({ code: "refused:applied" });
    expect(decideApplyFit(author, facts("draft"), { ...fit, rerun: true })).toMatchObject({ code: "refused:rerun" });
    expect(decideApplyFit(author, facts("revision"), { ...fit, hasOutcome: false })).toMatchObject({ code: "refused:no-result" });
  });
});
