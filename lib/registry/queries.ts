import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import { db, type Database, type Tx } from "@/db/client";
import { modelFamilies, releases } from "@/db/schema";
import { sortVersionsDescending } from "./semver";

type Conn = Database | Tx;

const releaseColumns = {
  id: releases.id,
  familyId: releases.familyId,
  version: releases.version,
  sha256: releases.sha256,
  physicsHash: releases.physicsHash,
  changelog: releases.changelog,
  proposalId: releases.proposalId,
  createdAt: releases.createdAt,
  deprecatedAt: releases.deprecatedAt,
  deprecationReason: releases.deprecationReason,
  successorId: releases.successorId,
  withdrawnAt: releases.withdrawnAt,
  withdrawalReason: releases.withdrawalReason,
};

export type ReleaseSummary = Awaited<ReturnType<typeof listReleasesOfFamily>>[number];

/** Families with their newest release that is neither deprecated nor withdrawn (null when there is none). */
export async function listRegistryFamilies() {
  const rows = await db.execute<{ slug: string; title: string; description: string; dimension: number; version: string | null; sha256: string | null; released_at: string | null; releases: number }>(sql`
    select f.slug, f.title, f.description, f.dimension, l.version, l.sha256, l.created_at as released_at,
           (select count(*)::int from releases r2 where r2.family_id = f.id) as releases
    from model_families f
    left join lateral (
      select r.version, r.sha256, r.created_at from releases r
      where r.family_id = f.id and r.deprecated_at is null and r.withdrawn_at is null
      order by string_to_array(r.version, '.')::int[] desc limit 1
    ) l on true
    order by f.dimension, f.title`);
  return rows.rows.map((r) => ({ ...r, releasedAt: r.released_at ? new Date(r.released_at) : null }));
}

export async function getFamilyIdentity(conn: Conn, slug: string) {
  const [row] = await conn
    .select({ id: modelFamilies.id, slug: modelFamilies.slug, title: modelFamilies.title, description: modelFamilies.description, dimension: modelFamilies.dimension })
    .from(modelFamilies)
    .where(eq(modelFamilies.slug, slug));
  return row ?? null;
}

/** Newest version first (by semantic version, not by date). */
export async function listReleasesOfFamily(conn: Conn, familyId: string) {
  const rows = await conn.select(releaseColumns).from(releases).where(eq(releases.familyId, familyId)).orderBy(desc(releases.createdAt));
  const order = sortVersionsDescending(rows.map((r) => r.version));
  return rows.sort((a, b) => order.indexOf(a.version) - order.indexOf(b.version));
}

export async function listFamilyVersions(conn: Conn, familyId: string): Promise<string[]> {
  return (await conn.select({ version: releases.version }).from(releases).where(eq(releases.familyId, familyId))).map((r) => r.version);
}

/** One release without its document; "latest" means the newest that is neither deprecated nor withdrawn. */
export async function getReleaseMeta(conn: Conn, familyId: string, version: string) {
  if (version === "latest") return (await listReleasesOfFamily(conn, familyId)).find((r) => !r.deprecatedAt && !r.withdrawnAt) ?? null;
  const [row] = await conn.select(releaseColumns).from(releases).where(and(eq(releases.familyId, familyId), eq(releases.version, version)));
  return row ?? null;
}

export async function getReleaseDocument(conn: Conn, releaseId: string): Promise<unknown> {
  const [row] = await conn.select({ document: releases.document }).from(releases).where(eq(releases.id, releaseId));
  return row?.document ?? null;
}

export async function getReleaseWithDocument(conn: Conn, familyId: string, version: string) {
  const meta = await getReleaseMeta(conn, familyId, version);
  return meta ? { ...meta, document: await getReleaseDocument(conn, meta.id) } : null;
}

export async function getReleaseById(conn: Conn, id: string) {
  const [row] = await conn.select(releaseColumns).from(releases).where(eq(releases.id, id));
  return row ?? null;
}

/** Lock a release row for a deprecation or withdrawal (the trigger allows only those columns to change). */
export async function lockRelease(tx: Tx, familyId: string, version: string) {
  const [row] = await tx
    .select(releaseColumns)
    .from(releases)
    .where(and(eq(releases.familyId, familyId), eq(releases.version, version)))
    .for("update");
  return row ?? null;
}

export async function countReleasesOfProposal(conn: Conn, proposalId: string): Promise<number> {
  const [row] = await conn.select({ n: sql<number>`count(*)::int` }).from(releases).where(eq(releases.proposalId, proposalId));
  return row.n;
}
