import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { count, eq } from "drizzle-orm";
import { createProposal, saveRevision } from "@/board/service";
import { uploadReferenceBands } from "@/board/reference-upload";
import { db } from "@/db/client";
import { familyCurators, fitRuns, modelFamilies, releases, revisions } from "@/db/schema";
import { FINAL_FIT_STATUSES } from "@/lib/fits/record";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { versionOf } from "@/tests/support/board-fixtures";
import { appUrl, HttpSession } from "@/tests/support/http-session";
import { createPerson } from "@/tests/support/people";
import { seededNormal } from "@/tests/unit/tb/analysis/seeded-noise";
import { waitFor } from "./registry-world";

/** A family whose release is `truth`, its curator, an author and a reviewer. */
export async function createFitWorld(truth: ModelDocument) {
  const curator = await createPerson(["curator"]);
  const slug = `fit-${randomUUID().slice(0, 8)}`;
  const [family] = await db
    .insert(modelFamilies)
    .values({ slug, title: `Family ${slug}`, description: "test", dimension: truth.lattice.dimension, acceptanceCriteria: [], requiredAccepts: 1 })
    .returning({ id: modelFamilies.id });
  await db.insert(familyCurators).values({ familyId: family.id, userId: curator.id });
  const [release] = await db
    .insert(releases)
    .values({ familyId: family.id, version: "1.0.0", document: truth, sha256: documentHash(truth), physicsHash: physicsHash(truth), changelog: "fixture" })
    .returning({ id: releases.id });
  return { slug, releaseId: release.id, curator, author: await createPerson(["author"]), reviewer: await createPerson(["reviewer"]), stranger: await createPerson(["consumer"]) };
}
export type FitWorld = Awaited<ReturnType<typeof createFitWorld>>;

/**
 * Synthetic reference bands in the upload's JSON form: the bands of `truth` on its default path (pointsTotal
 * points) plus seeded Gaussian noise of `sigma` eV, so the test knows the parameters behind them.
 */
export function syntheticReference(truth: ModelDocument, sigma: number, seed: number, pointsTotal?: number): string {
  const path = samplePath(truth, pointsTotal);
  const bands = computeBands(compileModel(truth), path.kFrac).energies;
  const noise = seededNormal(seed);
  return JSON.stringify({
    format: "bandgate-reference-bands",
    version: 1,
    energyUnit: "eV",
    k: { kind: "index", values: path.kFrac.map((_, i) => i) },
    energies: bands.map((row) => Array.from(row, (e) => e + sigma * noise())),
  });
}

/** A draft proposal whose latest revision has `start` values, with a synthetic reference set attached. */
export async function proposalToFit(world: FitWorld, truth: ModelDocument, start: Record<string, number>, reference: string, pointsTotal?: number) {
  const { proposalId } = await createProposal(world.author, { familySlug: world.slug, baseReleaseId: world.releaseId, title: "Refit fixture", rationale: "" });
  const doc = setParameters(truth, start);
  const withPath = pointsTotal ? { ...doc, kPath: { ...doc.kPath, pointsTotal } } : doc;
  await saveRevision(world.author, { proposalId, version: await versionOf(proposalId), document: withPath, note: "start values" });
  const { referenceId } = await uploadReferenceBands(world.author, {
    proposalId,
    name: "synthetic bands",
    fileName: "synthetic.json",
    content: reference,
    provenance: { method: "synthetic: bands of known parameters plus seeded noise", code: "test fixture", structureSource: "the model's own lattice" },
  });
  return { proposalId, referenceId };
}

export async function fitRow(fitId: string) {
  const [row] = await db.select().from(fitRuns).where(eq(fitRuns.id, fitId));
  return row;
}

export async function revisionCount(proposalId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(revisions).where(eq(revisions.proposalId, proposalId));
  return row.n;
}

export async function revisionDocument(revisionId: string) {
  const [row] = await db.select().from(revisions).where(eq(revisions.id, revisionId));
  return { row, doc: parseModelDocument(row.document) };
}

/** Starts a refit over HTTP; anything but 202 throws with the answer. */
export async function startFitOverHttp(session: HttpSession, proposalId: string, body: unknown): Promise<string> {
  const res = await session.json(`/api/proposals/${proposalId}/fits`, "POST", body);
  if (res.status !== 202) throw new Error(`starting the refit answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { fitId: string }).fitId;
}

export async function fitRunCount(proposalId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(fitRuns).where(eq(fitRuns.proposalId, proposalId));
  return row.n;
}

/** Polls the record until the run reached a final status. */
export function finishedFit(fitId: string, seconds = 25) {
  return waitFor(`fit ${fitId} to finish`, async () => {
    const row = await fitRow(fitId);
    return FINAL_FIT_STATUSES.includes(row.status) && row;
  }, seconds);
}

/** Signed in over HTTP as a browser would be. */
export async function signedIn(person: { email: string; password: string }): Promise<HttpSession> {
  const session = new HttpSession(appUrl());
  const error = await session.signIn(person.email, person.password);
  if (error) throw new Error(`sign-in of ${person.email} failed: ${error}`);
  return session;
}

/** The five parameters of the s + pz chain (pp_pi has no effect along the axis and stays fixed). */
export const CHAIN_KEYS = ["onsite/A/s", "onsite/A/pz", "shell/A-A/1/ss_sigma", "shell/A-A/1/sp_sigma", "shell/A-A/1/pp_sigma"];

/** Start values off the chain's truth (ε_s −5, sp_sigma 1.8, pp_sigma 2.6) by +0.4, −0.4 and +0.3 eV. */
export const CHAIN_START = { "onsite/A/s": -4.6, "shell/A-A/1/sp_sigma": 1.4, "shell/A-A/1/pp_sigma": 2.9 };

/** The demo diamond-lattice sp3s* model (one species, nearest neighbours, invented values). */
export function diamondDocument(): ModelDocument {
  return parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-diamond-sp3s.json", "utf8")));
}

/** Seven of the sp3s* model's parameters (its s*–s and s*–s* integrals are zero and stay fixed). */
export const DIAMOND_KEYS = ["onsite/X/s", "onsite/X/s*", "shell/X-X/1/ss_sigma", "shell/X-X/1/sp_sigma", "shell/X-X/1/pp_sigma", "shell/X-X/1/pp_pi", "shell/X-X/1/s*p_sigma"];

/** Start values 0.1–0.3 eV off the demo diamond's. */
export const DIAMOND_START = {
  "onsite/X/s": -3.7,
  "onsite/X/s*": 6.8,
  "shell/X-X/1/ss_sigma": -1.7,
  "shell/X-X/1/sp_sigma": 2.6,
  "shell/X-X/1/pp_sigma": 2.8,
  "shell/X-X/1/pp_pi": -1.0,
  "shell/X-X/1/s*p_sigma": 2.1,
};
