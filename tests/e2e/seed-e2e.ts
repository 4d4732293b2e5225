import { readFileSync } from "node:fs";
import bcrypt from "bcryptjs";
import { eq, inArray } from "drizzle-orm";
import { assignReviewer, createProposal, moveProposal, saveRevision } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { familyCurators, modelFamilies, proposals, releases, users } from "@/db/schema";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { E2E_FAMILY, E2E_PASSWORD, E2E_PEOPLE, E2E_PROPOSALS, E2E_SECOND_REVIEWER } from "./fixtures/people";

/**
 * Test data for the browser tests (never the demo data): one account per role, one family with a release, and
 * proposals made through the real use-cases. Run with tsx --conditions=react-server by global-setup.ts.
 */
const url = process.env.DATABASE_URL ?? "";
if (!/_test(\?|$)/.test(url)) throw new Error("End-to-end tests need DATABASE_URL to name a *_test database (run `npm test`).");

const hash = await bcrypt.hash(E2E_PASSWORD, 10);
const people: Record<string, { id: string; email: string; name: string; roles: ("author" | "reviewer" | "curator" | "consumer" | "admin")[] }> = {};
for (const [key, p] of [...Object.entries(E2E_PEOPLE), ["reviewer2", E2E_SECOND_REVIEWER] as const]) {
  const [row] = await db
    .insert(users)
    .values({ email: p.email, name: p.name, roles: p.roles, passwordHash: hash })
    .onConflictDoUpdate({ target: users.email, set: { roles: p.roles, passwordHash: hash, active: true } })
    .returning({ id: users.id });
  people[key] = { id: row.id, email: p.email, name: p.name, roles: p.roles };
}

const raw = JSON.parse(readFileSync("db/seed/models/demo-sp-chain.json", "utf8"));
const base: ModelDocument = parseModelDocument({
  ...raw,
  name: "e2e-chain",
  provenance: { ...raw.provenance, referenceCode: "test fixture", functional: "not applicable", kMesh: "not applicable" },
});

let [family] = await db.select().from(modelFamilies).where(eq(modelFamilies.slug, E2E_FAMILY.slug));
if (family) {
  const ids = (await db.select({ id: proposals.id }).from(proposals).where(eq(proposals.familyId, family.id))).map((p) => p.id);
  if (ids.length) await db.delete(proposals).where(inArray(proposals.id, ids));
} else {
  [family] = await db.insert(modelFamilies).values({ slug: E2E_FAMILY.slug, title: E2E_FAMILY.title, description: "Test fixture family.", dimension: 1, requiredAccepts: 2 }).returning();
  await db.insert(familyCurators).values({ familyId: family.id, userId: people.curator.id });
  await db.insert(releases).values({ familyId: family.id, version: "1.0.0", document: base, sha256: documentHash(base), physicsHash: physicsHash(base), changelog: "Test fixture release.", releasedBy: people.curator.id });
}
const [release] = await db.select().from(releases).where(eq(releases.familyId, family.id));

async function version(id: string) {
  const [row] = await db.select({ version: proposals.version }).from(proposals).where(eq(proposals.id, id));
  return row.version;
}

async function proposalAt(title: string, stage: "draft" | "submitted" | "under_review", reviewers = 1) {
  const { proposalId } = await createProposal(people.author, { familySlug: family.slug, baseReleaseId: release.id, title, rationale: "Test fixture." });
  const doc = setParameters(base, { "shell/A-A/1/sp_sigma": 1.9 });
  doc.provenance.citations["shell/A-A/1/sp_sigma"] = "test fixture change";
  await saveRevision(people.author, { proposalId, version: await version(proposalId), document: doc, note: "fixture change" });
  if (stage === "draft") return;
  await moveProposal(people.author, { proposalId, version: await version(proposalId), to: "submitted" });
  await assignReviewer(people.curator, { proposalId, version: await version(proposalId), reviewerId: people.reviewer.id });
  if (reviewers > 1) await assignReviewer(people.curator, { proposalId, version: await version(proposalId), reviewerId: people.reviewer2.id });
  if (stage === "submitted") return;
  await moveProposal(people.curator, { proposalId, version: await version(proposalId), to: "under_review" });
}

for (const p of E2E_PROPOSALS) await proposalAt(p.title, p.stage, "reviewers" in p ? p.reviewers : 1);
const { seedRegistryE2E } = await import("./pages/registry-fixture");
await seedRegistryE2E(people, base);
const { seedRefitE2E } = await import("./pages/refit-fixture");
await seedRefitE2E(people);
await closeDb();
