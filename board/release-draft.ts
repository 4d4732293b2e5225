import "server-only";
import { eq } from "drizzle-orm";
import { db, type Database, type Tx } from "@/db/client";
import { modelFamilies, proposals } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { assessChange, suggestVersion, versionProblem } from "@/lib/registry/change-level";
import { draftChangelog } from "@/lib/registry/changelog";
import { listFamilyVersions } from "@/lib/registry/queries";
import type { SessionUser } from "@/lib/auth/session-user";
import { getFamilyCuratorIds, getLatestRevision, getRelease } from "./queries";
import { parseDocument } from "./revision-facts";
import { changedParameters } from "./submission";

/**
 * What releasing a proposal would publish: its latest document, the change level against its base release, the
 * suggested version (next after the family's newest release) and a changelog drafted from the keyed diff.
 */
export async function prepareRelease(conn: Database | Tx, proposalId: string, opts: { lockFamily?: boolean } = {}) {
  const [proposal] = await conn.select().from(proposals).where(eq(proposals.id, proposalId));
  if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
  const familyQuery = conn.select({ id: modelFamilies.id, slug: modelFamilies.slug, title: modelFamilies.title }).from(modelFamilies).where(eq(modelFamilies.id, proposal.familyId));
  // Releases of one family are serialised, so two curators cannot both take the same next version.
  const [family] = opts.lockFamily ? await familyQuery.for("update") : await familyQuery;
  const latest = await getLatestRevision(conn, proposal.id);
  const parsed = latest ? parseDocument(latest.document) : null;
  if (!parsed || !parsed.ok) throw new AppError("refused:release", "The latest revision is not a valid model document.");
  const base = proposal.baseReleaseId ? await getRelease(conn, proposal.baseReleaseId) : null;
  const baseParsed = base ? parseDocument(base.document) : null;
  const baseDoc = baseParsed && baseParsed.ok ? baseParsed.doc : null;
  const assessment = assessChange(baseDoc, parsed.doc);
  const existing = await listFamilyVersions(conn, family.id);
  const suggested = suggestVersion(existing, assessment.level);
  const changes = changedParameters(baseDoc, parsed.doc);
  return {
    proposalId: proposal.id,
    proposalVersion: proposal.version,
    title: proposal.title,
    stage: proposal.stage,
    familyId: family.id,
    familySlug: family.slug,
    familyTitle: family.title,
    baseVersion: base?.version ?? null,
    revision: latest!.number,
    document: parsed.doc,
    assessment,
    existing,
    suggested,
    changes,
    changelog: draftChangelog({ title: proposal.title, baseVersion: base?.version ?? null, assessment, changes, rationale: proposal.rationale }),
    versionProblem: (chosen: string) => versionProblem(chosen, suggested, existing),
  };
}

export type PreparedRelease = Awaited<ReturnType<typeof prepareRelease>>;

/** The release form's data, and whether this viewer may release (a curator of the family, on an accepted proposal). */
export async function getReleaseDraft(viewer: SessionUser, proposalId: string) {
  const prepared = await prepareRelease(db, proposalId);
  const curators = await getFamilyCuratorIds(db, prepared.familyId);
  const { versionProblem: _check, ...data } = prepared;
  return { ...data, mayRelease: viewer.roles.includes("curator") && curators.includes(viewer.id) && prepared.stage === "accepted" };
}
