import { describe, expect, it } from "vitest";
import { anchorFromQuery, decideRemarkAction, isDiscussionOpen, mayFlagBlocking, mayReadRemarks, mayWriteRemark, mentionedHandles, nextStatus, type RemarkContext, type RemarkStatus } from "@/board/remark-rules";
import { STAGES } from "@/board/stages";

const ctx: RemarkContext = { authorId: "author", assignedReviewerIds: ["rev", "author"], familyCuratorIds: ["cur"] };
const author = { id: "author", roles: ["author", "reviewer"] as const };
const reviewer = { id: "rev", roles: ["reviewer"] as const };
const curator = { id: "cur", roles: ["curator"] as const };
const listedCuratorWithoutRole = { id: "cur", roles: ["reviewer"] as const };
const stranger = { id: "x", roles: ["reviewer", "curator"] as const };

describe("who takes part in remarks", () => {
  it("lets the author, assigned reviewers and family curators write; nobody else", () => {
    expect([author, reviewer, curator].map((p) => mayWriteRemark(p, ctx))).toEqual([true, true, true]);
    expect(mayWriteRemark(stranger, ctx)).toBe(false);
    expect(mayWriteRemark(listedCuratorWithoutRole, ctx)).toBe(false);
  });
  it("lets only reviewers (never the author, even if assigned) and curators open blocking remarks", () => {
    expect(mayFlagBlocking(reviewer, ctx)).toBe(true);
    expect(mayFlagBlocking(curator, ctx)).toBe(true);
    expect(mayFlagBlocking(author, ctx)).toBe(false);
    expect(mayFlagBlocking(stranger, ctx)).toBe(false);
  });
});

describe("who reads remarks (and so may hear of a mention)", () => {
  it("every review role reads, as on the review workspace; a consumer or a person without roles does not", () => {
    for (const role of ["author", "reviewer", "curator", "admin"] as const) expect(mayReadRemarks({ roles: [role] })).toBe(true);
    expect(mayReadRemarks({ roles: ["consumer"] })).toBe(false);
    expect(mayReadRemarks({ roles: [] })).toBe(false);
  });
});

describe("the discussion closes with the proposal", () => {
  it("is open in every stage but released, declined and withdrawn", () => {
    expect(STAGES.filter((s) => !isDiscussionOpen(s))).toEqual(["released", "declined", "withdrawn"]);
  });
});

describe("remark states", () => {
  const remark = (status: RemarkStatus) => ({ writerId: "rev", status });
  it("open → addressed by the proposal's author only", () => {
    expect(decideRemarkAction(author, ctx, remark("open"), "address")).toBeNull();
    expect(decideRemarkAction(reviewer, ctx, remark("open"), "address")).toMatch(/author/);
    expect(decideRemarkAction(author, ctx, remark("addressed"), "address")).toMatch(/open remark/);
  });
  it("resolved by its writer or a curator, never by the author", () => {
    expect(decideRemarkAction(reviewer, ctx, remark("addressed"), "resolve")).toBeNull();
    expect(decideRemarkAction(curator, ctx, remark("open"), "resolve")).toBeNull();
    expect(decideRemarkAction(author, ctx, { writerId: "author", status: "open" }, "resolve")).toMatch(/cannot resolve/);
    expect(decideRemarkAction(reviewer, ctx, remark("resolved"), "resolve")).toMatch(/already/);
  });
  it("reopened by its writer or a curator", () => {
    expect(decideRemarkAction(reviewer, ctx, remark("resolved"), "reopen")).toBeNull();
    expect(decideRemarkAction(author, ctx, remark("resolved"), "reopen")).toMatch(/writer/);
    expect(decideRemarkAction(reviewer, ctx, remark("open"), "reopen")).toMatch(/already/);
  });
  it("maps actions to states", () => {
    expect(["address", "resolve", "reopen"].map((a) => nextStatus(a as never))).toEqual(["addressed", "resolved", "open"]);
  });
});

describe("anchors and mentions", () => {
  it("reads anchors from the diff table's and the band plot's links", () => {
    expect(anchorFromQuery("param:shell/A-A/1/sp_sigma")).toEqual({ kind: "parameter", key: "shell/A-A/1/sp_sigma" });
    expect(anchorFromQuery("k:Γ-X")).toEqual({ kind: "k-range", from: "Γ", to: "X" });
    expect(anchorFromQuery("k:0.120-0.480")).toEqual({ kind: "k-range", from: "0.120", to: "0.480" });
    expect(anchorFromQuery(undefined)).toEqual({ kind: "proposal" });
  });
  it("finds @handles but not e-mail addresses", () => {
    expect(mentionedHandles("@noor.haddad please look; cc @Tomasz.W. Mail me at a@b.org")).toEqual(["noor.haddad", "tomasz.w"]);
  });
});
