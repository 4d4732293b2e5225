import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { proposals, referenceBandSets, revisions } from "@/db/schema";
import { DOCUMENT_TOO_LARGE, REFERENCE_TOO_LARGE } from "@/lib/size-limits";
import type { ModelDocument } from "@/lib/tb/document";
import { postActionForm } from "../support/action-form";
import { createBoardWorld, draftProposal, versionOf, type BoardWorld } from "../support/board-fixtures";
import { gridModel } from "../support/grid-model";
import { appUrl, HttpSession } from "../support/http-session";

afterAll(closeDb);

const MIB = 1024 * 1024;
/** 80 states: above the default limit of 64, and cheap to refuse (nothing is computed for it). */
const overBasis = gridModel([2, 2, 5]);
const BASIS_MESSAGE = "The model's basis has 80 states (80 orbitals per cell); this Bandgate accepts models of at most 64 states.";
/** A valid document whose description makes it 2.5 MiB: over the one document limit of 2 MiB. */
const overBytes = (base: ModelDocument): ModelDocument => ({ ...base, description: "x".repeat(2.5 * MIB) });

async function signedIn(world: BoardWorld): Promise<HttpSession> {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(world.author.email, world.author.password)).toBeNull();
  return session;
}

const revisionCount = async (proposalId: string) => (await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.proposalId, proposalId))).length;
const proposalsTitled = async (title: string) => (await db.select({ id: proposals.id }).from(proposals).where(eq(proposals.title, title))).length;

describe("one document size limit and the basis limit, on every path that takes a document", () => {
  it("JSON API, new proposal: refuses a basis over the limit (422) and a document over 2 MiB (413), storing nothing", async () => {
    const world = await createBoardWorld();
    const author = await signedIn(world);
    const titles = ["too many states", "too many bytes", "five megabytes", "streamed"].map((t) => `${t} ${world.familySlug}`);
    const post = (title: string, document: unknown) => author.json("/api/proposals", "POST", { familySlug: world.familySlug, baseReleaseId: null, title, document });

    const basis = await post(titles[0], overBasis);
    expect(basis.status).toBe(422);
    expect((await basis.json()).error).toMatchObject({ code: "refused:basis-size", message: BASIS_MESSAGE, details: { basis: 80, limit: 64 } });

    const bytes = await post(titles[1], overBytes(world.base));
    expect(bytes.status).toBe(413);
    expect((await bytes.json()).error).toMatchObject({ code: "too-large:document", message: DOCUMENT_TOO_LARGE });

    // A 5 MB description: refused by its Content-Length, before the body is read.
    const huge = await post(titles[2], { ...world.base, description: "x".repeat(5_000_000) });
    expect(huge.status).toBe(413);
    expect((await huge.json()).error.message).toBe(DOCUMENT_TOO_LARGE);

    // The same without a Content-Length (streamed): refused while it arrives.
    const text = JSON.stringify({ familySlug: world.familySlug, baseReleaseId: null, title: titles[3], document: { ...world.base, description: "x".repeat(5_000_000) } });
    const bytesOut = new TextEncoder().encode(text);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < bytesOut.length; i += 64 * 1024) controller.enqueue(bytesOut.subarray(i, i + 64 * 1024));
        controller.close();
      },
    });
    const streamed = await author.fetch("/api/proposals", { method: "POST", headers: { "content-type": "application/json" }, body: stream, duplex: "half" } as RequestInit);
    expect(streamed.status).toBe(413);
    expect((await streamed.json()).error.message).toBe(DOCUMENT_TOO_LARGE);

    for (const title of titles) expect(await proposalsTitled(title)).toBe(0);
  });

  it("JSON API, new revision: the same refusals, and no revision is added", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await signedIn(world);
    const before = await revisionCount(id);
    const version = await versionOf(id);

    const basis = await author.json(`/api/proposals/${id}/revisions`, "POST", { version, document: overBasis });
    expect(basis.status).toBe(422);
    expect((await basis.json()).error.message).toBe(BASIS_MESSAGE);
    const bytes = await author.json(`/api/proposals/${id}/revisions`, "POST", { version, document: overBytes(world.base) });
    expect(bytes.status).toBe(413);
    expect((await bytes.json()).error.message).toBe(DOCUMENT_TOO_LARGE);

    expect(await revisionCount(id)).toBe(before);
    expect(await versionOf(id)).toBe(version);
  });

  it("the editor's save form (server action): the same messages on the page, and no revision is added", { timeout: 60_000 }, async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await signedIn(world);
    const before = await revisionCount(id);
    const save = async (document: unknown) =>
      postActionForm(author, `/proposals/${id}`, "Edit parameters", { proposalId: id, version: String(await versionOf(id)), note: "too large", document: JSON.stringify(document) });

    const basis = await save(overBasis);
    expect(basis.status).toBe(200);
    expect(basis.html).toContain(BASIS_MESSAGE);
    const bytes = await save(overBytes(world.base));
    expect(bytes.status).toBe(200);
    expect(bytes.html).toContain(DOCUMENT_TOO_LARGE);

    expect(await revisionCount(id)).toBe(before);
  });

  it("reference band uploads: a file over 5 MiB is refused (413) with its message, before or while it is read; nothing is stored", async () => {
    const world = await createBoardWorld();
    const id = await draftProposal(world);
    const author = await signedIn(world);
    const provenance = { method: "DFT-PBE", code: "fixture 1.0", structureSource: "fixture chain" };
    const row = "0,-7.800000,6.700000\n";
    const content = "k_index,E1 (eV),E2 (eV)\n" + row.repeat(Math.ceil((5 * MIB) / row.length));
    expect(new TextEncoder().encode(content).length).toBeGreaterThan(5 * MIB);

    const res = await author.json(`/api/proposals/${id}/reference-bands`, "POST", { name: "large", fileName: "large.csv", content: content.slice(0, 5 * MIB + 1), provenance });
    expect(res.status).toBe(413);
    expect((await res.json()).error).toMatchObject({ code: "too-large:reference", message: REFERENCE_TOO_LARGE });
    const declared = await author.json(`/api/proposals/${id}/reference-bands`, "POST", { name: "huge", fileName: "huge.csv", content: content.repeat(2), provenance });
    expect(declared.status).toBe(413);
    expect((await declared.json()).error.message).toBe(REFERENCE_TOO_LARGE);

    expect(await db.select().from(referenceBandSets).where(eq(referenceBandSets.proposalId, id))).toHaveLength(0);
  });
});
