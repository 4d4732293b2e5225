import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { createProposal, saveRevision } from "@/board/service";
import { db } from "@/db/client";
import { familyCurators, modelFamilies, proposals, releases } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { createPerson } from "./people";

/** The demo s+pz chain as a test fixture, with the provenance a submission needs. */
export function chainDocument(): ModelDocument {
  const raw = JSON.parse(readFileSync("db/seed/models/demo-sp-chain.json", "utf8"));
  return parseModelDocument({ ...raw, provenance: { ...raw.provenance, referenceCode: "fixture", functional: "not applicable", kMesh: "not applicable" } });
}

export function changedChain(base: ModelDocument, key: string, value: number): ModelDocument {
  const doc = setParameters(base, { [key]: value });
  return { ...doc, provenance: { ...doc.provenance, citations: { ...doc.provenance.citations, [key]: "fixture change" } } };
}

type Person = SessionUser & { password: string };

export interface BoardWorld {
  familySlug: string;
  releaseId: string;
  base: ModelDocument;
  author: Person;
  curator: Person;
  reviewers: Person[];
  stranger: Person;
}

/** A fresh family with a release (the demo chain unless `base` is given), its curator, an author, three reviewers and a bystander. */
export async function createBoardWorld(opts: { criteria?: unknown[]; requiredAccepts?: number; base?: ModelDocument } = {}): Promise<BoardWorld> {
  const base = opts.base ?? chainDocument();
  const curator = await createPerson(["curator"]);
  const slug = `fam-${randomUUID().slice(0, 8)}`;
  const [family] = await db
    .insert(modelFamilies)
    .values({ slug, title: `Family ${slug}`, description: "test", dimension: base.lattice.dimension, acceptanceCriteria: opts.criteria ?? [], requiredAccepts: opts.requiredAccepts ?? 2 })
    .returning({ id: modelFamilies.id });
  await db.insert(familyCurators).values({ familyId: family.id, userId: curator.id });
  const [release] = await db
    .insert(releases)
    .values({ familyId: family.id, version: "1.0.0", document: base, sha256: documentHash(base), physicsHash: physicsHash(base), changelog: "fixture" })
    .returning({ id: releases.id });
  return {
    familySlug: slug,
    releaseId: release.id,
    base,
    curator,
    author: await createPerson(["author"]),
    reviewers: [await createPerson(["reviewer"]), await createPerson(["reviewer"]), await createPerson(["reviewer"])],
    stranger: await createPerson(["consumer"]),
  };
}

export async function versionOf(proposalId: string): Promise<number> {
  const [row] = await db.select({ version: proposals.version }).from(proposals).where(eq(proposals.id, proposalId));
  return row.version;
}

/** A draft whose latest revision changes sp_sigma (with a citation), ready to submit. */
export async function draftProposal(world: BoardWorld, value = 1.9): Promise<string> {
  const { proposalId } = await createProposal(world.author, { familySlug: world.familySlug, baseReleaseId: world.releaseId, title: "Fixture proposal", rationale: "" });
  await saveRevision(world.author, { proposalId, version: await versionOf(proposalId), document: changedChain(world.base, "shell/A-A/1/sp_sigma", value), note: "fixture" });
  return proposalId;
}
