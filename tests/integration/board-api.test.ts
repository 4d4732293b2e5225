import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditEvents, proposals, referenceBandSets } from "@/db/schema";
import { createBoardWorld, draftProposal, versionOf } from "../support/board-fixtures";
import { appUrl, HttpSession } from "../support/http-session";

afterAll(closeDb);

async function sessionFor(person: { email: string; password: string }) {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

describe("board API over HTTP", () => {
  it("moves with the right person, refuses others with the right status, and answers a stale card with 409 and the current card", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const version = await versionOf(id);

    const stranger = await sessionFor(world.stranger);
    const forbidden = await stranger.json(`/api/proposals/${id}/moves`, "POST", { version, to: "submitted" });
    expect(forbidden.status).toBe(403);
    expect((await forbidden.json()).error.code).toBe("forbidden:move");

    const author = await sessionFor(world.author);
    const invalid = await author.json(`/api/proposals/${id}/moves`, "POST", { version, to: "accepted" });
    expect(invalid.status).toBe(400);
    const ok = await author.json(`/api/proposals/${id}/moves`, "POST", { version, to: "submitted" });
    expect(ok.status).toBe(200);
    expect((await ok.json()).card).toMatchObject({ stage: "submitted", version: version + 1 });

    const stale = await author.json(`/api/proposals/${id}/moves`, "POST", { version, to: "withdrawn" });
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.error.code).toBe("conflict:stale");
    expect(body.error.details.current).toMatchObject({ id, stage: "submitted" });

    const bad = await author.json(`/api/proposals/${id}/moves`, "POST", { version: "x", to: "nowhere" });
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fieldErrors).sort()).toEqual(["to", "version"]);
    expect((await author.json(`/api/proposals/00000000-0000-4000-8000-000000000000/moves`, "POST", { version: 1, to: "submitted" })).status).toBe(404);

    const moves = (await db.select().from(auditEvents).where(eq(auditEvents.subjectId, id))).filter((e) => e.action === "proposal.moved");
    expect(moves).toHaveLength(1);
  });

  it("answers a failed gate with 422 and every reason", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    await db.update(proposals).set({ stage: "submitted" }).where(eq(proposals.id, id));
    const curator = await sessionFor(world.curator);
    const res = await curator.json(`/api/proposals/${id}/moves`, "POST", { version: await versionOf(id), to: "under_review" });
    expect(res.status).toBe(422);
    expect((await res.json()).error.details.reasons).toEqual(["Assign at least one reviewer first."]);
  });

  it("serves the board's cards with filters, to review roles only", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await sessionFor(world.author);
    const res = await author.fetch(`/api/board?family=${world.familySlug}&mine=authored`);
    expect(res.status).toBe(200);
    const { cards } = await res.json();
    expect(cards.map((c: { id: string }) => c.id)).toEqual([id]);
    expect(cards[0]).toMatchObject({ stage: "draft", revision: 2, baseVersion: "1.0.0", checksPassing: true });
    expect(cards[0].shiftProfile.length).toBeGreaterThan(10);
    const none = await (await author.fetch(`/api/board?family=${world.familySlug}&stage=accepted`)).json();
    expect(none.cards).toEqual([]);
    const consumer = await sessionFor(world.stranger);
    expect((await consumer.fetch("/api/board")).status).toBe(403);
  });
});

describe("reference band uploads", () => {
  it("stores nothing from a bad file and names the line and column; stores a good file with its checksum", async () => {
    const { uploadReferenceBands } = await import("@/board/reference-upload");
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const provenance = { method: "DFT-PBE", code: "fixture code 1.0", structureSource: "fixture chain" };
    const bad = "k_index,E1 (eV),E2 (eV)\n0,-7.8,6.7\n1,abc,6.6\n";
    await expect(uploadReferenceBands(world.author, { proposalId: id, name: "bad", fileName: "bad.csv", content: bad, provenance })).rejects.toThrow(/line 3, column 2/);
    await expect(uploadReferenceBands(world.author, { proposalId: id, name: "no provenance", fileName: "ok.csv", content: "k_index,E1 (eV)\n0,1\n", provenance: {} })).rejects.toThrow(/provenance/);
    await expect(uploadReferenceBands(world.reviewers[0], { proposalId: id, name: "x", fileName: "ok.csv", content: "k_index,E1 (eV)\n0,1\n", provenance })).rejects.toThrow(/author/);
    expect(await db.select().from(referenceBandSets).where(eq(referenceBandSets.proposalId, id))).toHaveLength(0);

    const good = "# fixture\nk_index,E1 (eV),E2 (eV)\n0,-7.8,6.7\n1,-7.79,6.69\n";
    const { referenceId } = await uploadReferenceBands(world.author, { proposalId: id, name: "good", fileName: "good.csv", content: good, provenance });
    const [row] = await db.select().from(referenceBandSets).where(eq(referenceBandSets.id, referenceId));
    expect(row).toMatchObject({ sizeBytes: good.length, fileName: "good.csv" });
    expect(row.sha256).toMatch(/^[0-9a-f]{64}$/);
  });
});
