import { eq } from "drizzle-orm";
import { assignReviewer, createProposal, giveVerdict, moveProposal, saveRevision } from "@/board/service";
import { db } from "@/db/client";
import { familyCurators, modelFamilies, proposals, releases } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import type { ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { E2E_REGISTRY } from "./registry-names";

type Person = { id: string; email: string; name: string; roles: Role[] };

/** The registry's browser-test data: a family needing one accept, with release 1.0.0 and an accepted proposal. */
export async function seedRegistryE2E(people: Record<string, Person>, base: ModelDocument): Promise<void> {
  const [existing] = await db.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, E2E_REGISTRY.slug));
  if (existing) return;
  const doc = { ...base, name: E2E_REGISTRY.slug };
  const [family] = await db.insert(modelFamilies).values({ slug: E2E_REGISTRY.slug, title: E2E_REGISTRY.title, description: "Registry test fixture.", dimension: 1, requiredAccepts: 1 }).returning();
  await db.insert(familyCurators).values({ familyId: family.id, userId: people.curator.id });
  const [release] = await db
    .insert(releases)
    .values({ familyId: family.id, version: "1.0.0", document: doc, sha256: documentHash(doc), physicsHash: physicsHash(doc), changelog: "Registry test fixture release.", releasedBy: people.curator.id })
    .returning({ id: releases.id });
  const version = async (id: string) => (await db.select({ v: proposals.version }).from(proposals).where(eq(proposals.id, id)))[0].v;
  const { proposalId } = await createProposal(people.author, { familySlug: family.slug, baseReleaseId: release.id, title: E2E_REGISTRY.proposal, rationale: "Stiffer s–p bond for the registry test." });
  const next = setParameters(doc, { "shell/A-A/1/sp_sigma": 2.0 });
  next.provenance.citations["shell/A-A/1/sp_sigma"] = "registry test fixture change";
  await saveRevision(people.author, { proposalId, version: await version(proposalId), document: next, note: "sp_sigma 1.8 → 2.0" });
  await moveProposal(people.author, { proposalId, version: await version(proposalId), to: "submitted" });
  await assignReviewer(people.curator, { proposalId, version: await version(proposalId), reviewerId: people.reviewer.id });
  await moveProposal(people.curator, { proposalId, version: await version(proposalId), to: "under_review" });
  await giveVerdict(people.reviewer, { proposalId, verdict: "accept", summary: "Fine." });
  await moveProposal(people.curator, { proposalId, version: await version(proposalId), to: "accepted" });
}
