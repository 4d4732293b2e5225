import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { createProposal } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { familyCurators, modelFamilies, revisions } from "@/db/schema";
import { createFamilyInput } from "@/lib/families/schemas";
import { createFamily } from "@/lib/families/service";
import { validateModelDocument } from "@/lib/tb/document";
import { createPerson } from "../support/people";

afterAll(closeDb);

describe("opening a model family", () => {
  it("makes its creator the curator, refuses other roles and taken slugs, and starts proposals from a blank model", async () => {
    const curator = await createPerson(["curator"]);
    const author = await createPerson(["author"]);
    const slug = `new-${randomUUID().slice(0, 8)}`;
    const input = createFamilyInput.parse({ slug, title: "New family", dimension: "2", acceptanceCriteria: '[{"metric":"gap","target":1,"tolerance":0.1}]' });
    await expect(createFamily(author, input)).rejects.toThrow(/Only curators/);
    await createFamily(curator, input);
    const [family] = await db.select().from(modelFamilies).where(eq(modelFamilies.slug, slug));
    expect(family).toMatchObject({ dimension: 2, requiredAccepts: 2, acceptanceCriteria: [{ metric: "gap", target: 1, tolerance: 0.1 }] });
    expect(await db.select().from(familyCurators).where(eq(familyCurators.familyId, family.id))).toEqual([{ familyId: family.id, userId: curator.id }]);
    await expect(createFamily(curator, input)).rejects.toThrow(/exists already/);

    const { proposalId } = await createProposal(author, { familySlug: slug, baseReleaseId: null, title: "First model", rationale: "" });
    const [first] = await db.select().from(revisions).where(eq(revisions.proposalId, proposalId));
    const report = validateModelDocument(first.document);
    expect(report.errors).toEqual([]);
    expect(report.document?.lattice.dimension).toBe(2);
  });

  it("explains bad acceptance criteria", () => {
    const bad = createFamilyInput.safeParse({ slug: "ok-slug", title: "Title", dimension: 3, acceptanceCriteria: '[{"metric":"gap","target":1}]' });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].message).toMatch(/tolerance/);
    const notJson = createFamilyInput.safeParse({ slug: "ok-slug", title: "Title", dimension: 3, acceptanceCriteria: "[{" });
    expect(notJson.error!.issues[0].message).toMatch(/JSON list/);
  });
});
