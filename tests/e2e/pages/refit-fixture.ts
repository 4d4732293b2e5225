import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { uploadReferenceBands } from "@/board/reference-upload";
import { createProposal, saveRevision } from "@/board/service";
import { db } from "@/db/client";
import { familyCurators, modelFamilies, proposals, releases } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";
import { computeBands } from "@/lib/tb/bands";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { E2E_REFIT } from "./refit-names";

type Person = { id: string; email: string; name: string; roles: Role[] };

/**
 * A 3D sp3s*-type family and a draft whose start values are off, with reference bands made from the released values
 * (exact, no noise) on a dense path: a refit has a known answer, and with many free parameters and extra starts it runs
 * long enough to watch and cancel.
 */
export async function seedRefitE2E(people: Record<string, Person>): Promise<void> {
  const [existing] = await db.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, E2E_REFIT.slug));
  if (existing) {
    const ids = await db.select({ id: proposals.id }).from(proposals).where(eq(proposals.familyId, existing.id));
    for (const { id } of ids) await db.delete(proposals).where(eq(proposals.id, id));
  }
  const raw = JSON.parse(readFileSync("db/seed/models/demo-diamond-sp3s.json", "utf8"));
  const truth = parseModelDocument({ ...raw, name: E2E_REFIT.slug, provenance: { ...raw.provenance, referenceCode: "test fixture", functional: "not applicable", kMesh: "not applicable" } });
  let familyId = existing?.id;
  if (!familyId) {
    const [family] = await db.insert(modelFamilies).values({ slug: E2E_REFIT.slug, title: E2E_REFIT.title, description: "Refit test fixture.", dimension: 3, requiredAccepts: 1 }).returning();
    familyId = family.id;
    await db.insert(familyCurators).values({ familyId, userId: people.curator.id });
    await db.insert(releases).values({ familyId, version: "1.0.0", document: truth, sha256: documentHash(truth), physicsHash: physicsHash(truth), changelog: "Refit test fixture release.", releasedBy: people.curator.id });
  }
  const [release] = await db.select().from(releases).where(eq(releases.familyId, familyId));
  const { proposalId } = await createProposal(people.author, { familySlug: E2E_REFIT.slug, baseReleaseId: release.id, title: E2E_REFIT.proposal, rationale: "Refit test fixture." });
  // 3000 k-points: one iteration with every parameter free takes a few hundred ms, so nine starts run well over ten
  // seconds — time to watch and cancel — while three free parameters still finish in seconds.
  const onDensePath = { ...truth, kPath: { ...truth.kPath, pointsTotal: 3000 } };
  const start = setParameters(onDensePath, { "shell/X-X/1/sp_sigma": 2.2, "shell/X-X/1/pp_pi": -1.0, "shell/X-X/1/ss_sigma": -1.8 });
  for (const key of ["shell/X-X/1/sp_sigma", "shell/X-X/1/pp_pi", "shell/X-X/1/ss_sigma"]) start.provenance.citations[key] = "refit test start value";
  const version = async () => (await db.select({ v: proposals.version }).from(proposals).where(eq(proposals.id, proposalId)))[0].v;
  await saveRevision(people.author, { proposalId, version: await version(), document: start, note: "start values for the refit test" });
  const path = samplePath(onDensePath);
  const energies = computeBands(compileModel(onDensePath), path.kFrac).energies.map((row) => Array.from(row));
  await uploadReferenceBands(people.author, {
    proposalId,
    name: "Released-value bands",
    fileName: "released-value-bands.json",
    content: JSON.stringify({ format: "bandgate-reference-bands", version: 1, energyUnit: "eV", k: { kind: "index", values: path.kFrac.map((_, i) => i) }, energies }),
    provenance: { method: "bands of the released parameters (test fixture)", code: "test fixture", structureSource: "the family's released structure" },
  });
}
