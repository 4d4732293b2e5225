import "server-only";
import { and, asc, desc, eq, sql, type SQL } from "drizzle-orm";
import { db, type Database, type Tx } from "@/db/client";
import { familyCurators, modelFamilies, proposals, referenceBandSets, releases, remarks, reviewerAssignments, revisions, users } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";
import type { BoardFilters } from "./schemas";
import type { BoardCard } from "./card";
import type { Stage } from "./stages";

export type { BoardCard };

type Conn = Database | Tx;


/**
 * One query for any number of cards: latest revision, fresh verdict tally (each assigned non-author reviewer's latest
 * verdict on the current physics hash) and open blocking remarks, computed in PostgreSQL.
 */
// Every part is materialised once: left to itself the planner may re-run the tally for each card (seen: 0.7 s for
// 167 cards of 1,000), because it cannot estimate the size of the CTEs.
function cardQuery(where: SQL): SQL {
  return sql`
    with picked as materialized (
      select p.* from proposals p join model_families f on f.id = p.family_id
      where ${where}
      order by p.updated_at desc
      limit 2000
    ),
    latest as materialized (
      select distinct on (r.proposal_id) r.proposal_id, r.number, r.physics_hash, r.checks_passing,
             r.checks_waived_reason is not null as waived, r.shift_profile, r.max_shift
      from revisions r where r.proposal_id in (select id from picked) order by r.proposal_id, r.number desc
    ),
    last_verdicts as materialized (
      select distinct on (v.proposal_id, v.reviewer_id) v.proposal_id, v.reviewer_id, v.verdict, v.physics_hash
      from verdicts v where v.proposal_id in (select id from picked) order by v.proposal_id, v.reviewer_id, v.created_at desc
    ),
    assigned as materialized (
      select ra.proposal_id, json_agg(json_build_object('id', u.id, 'name', u.name) order by u.name) as reviewers
      from reviewer_assignments ra join users u on u.id = ra.reviewer_id
      where ra.proposal_id in (select id from picked) group by ra.proposal_id
    ),
    tally as materialized (
      select lv.proposal_id,
        count(*) filter (where lv.physics_hash = l.physics_hash and lv.verdict = 'accept') as accept,
        count(*) filter (where lv.physics_hash = l.physics_hash and lv.verdict = 'minor_revision') as minor_revision,
        count(*) filter (where lv.physics_hash = l.physics_hash and lv.verdict = 'major_revision') as major_revision,
        count(*) filter (where lv.physics_hash = l.physics_hash and lv.verdict = 'decline') as decline,
        count(*) filter (where lv.physics_hash <> l.physics_hash) as stale
      from last_verdicts lv
      join latest l on l.proposal_id = lv.proposal_id
      join picked pp on pp.id = lv.proposal_id and pp.author_id <> lv.reviewer_id
      join reviewer_assignments ra on ra.proposal_id = lv.proposal_id and ra.reviewer_id = lv.reviewer_id
      group by lv.proposal_id
    ),
    blocking as materialized (
      select proposal_id, count(*) as n from remarks
      where blocking and status <> 'resolved' and proposal_id in (select id from picked) group by proposal_id
    )
    select p.id, p.title, p.stage, p.version, p.updated_at, p.author_id, au.name as author_name,
      f.slug as family_slug, f.title as family_title, f.required_accepts, br.version as base_version,
      coalesce(l.number, 0) as revision, coalesce(l.checks_passing, false) as checks_passing, coalesce(l.waived, false) as checks_waived,
      l.shift_profile, l.max_shift, coalesce(a.reviewers, '[]'::json) as reviewers,
      coalesce(t.accept, 0) as accept, coalesce(t.minor_revision, 0) as minor_revision, coalesce(t.major_revision, 0) as major_revision,
      coalesce(t.decline, 0) as decline, coalesce(t.stale, 0) as stale, coalesce(b.n, 0) as blocking
    from picked p
    join model_families f on f.id = p.family_id
    join users au on au.id = p.author_id
    left join releases br on br.id = p.base_release_id
    left join latest l on l.proposal_id = p.id
    left join assigned a on a.proposal_id = p.id
    left join tally t on t.proposal_id = p.id
    left join blocking b on b.proposal_id = p.id
    order by p.updated_at desc`;
}

function toCard(r: Record<string, unknown>): BoardCard {
  return {
    id: String(r.id),
    title: String(r.title),
    stage: r.stage as Stage,
    version: Number(r.version),
    updatedAt: new Date(r.updated_at as string).toISOString(),
    authorId: String(r.author_id),
    authorName: String(r.author_name),
    familySlug: String(r.family_slug),
    familyTitle: String(r.family_title),
    requiredAccepts: Number(r.required_accepts),
    baseVersion: (r.base_version as string | null) ?? null,
    revision: Number(r.revision),
    checksPassing: Boolean(r.checks_passing),
    checksWaived: Boolean(r.checks_waived),
    shiftProfile: (r.shift_profile as number[] | null) ?? null,
    maxShift: r.max_shift === null || r.max_shift === undefined ? null : Number(r.max_shift),
    reviewers: r.reviewers as { id: string; name: string }[],
    tally: {
      accept: Number(r.accept),
      minor_revision: Number(r.minor_revision),
      major_revision: Number(r.major_revision),
      decline: Number(r.decline),
      stale: Number(r.stale),
    },
    openBlockingRemarks: Number(r.blocking),
  };
}

export async function listBoardCards(filters: BoardFilters, viewerId: string): Promise<BoardCard[]> {
  const conditions: SQL[] = [sql`true`];
  if (filters.family.length) conditions.push(sql`f.slug in (${sql.join(filters.family.map((s) => sql`${s}`), sql`, `)})`);
  if (filters.stage.length) conditions.push(sql`p.stage::text in (${sql.join(filters.stage.map((s) => sql`${s}`), sql`, `)})`);
  if (filters.author) conditions.push(sql`p.author_id = ${filters.author}`);
  if (filters.mine === "authored") conditions.push(sql`p.author_id = ${viewerId}`);
  if (filters.mine === "assigned") conditions.push(sql`exists (select 1 from reviewer_assignments x where x.proposal_id = p.id and x.reviewer_id = ${viewerId})`);
  const result = await db.execute(cardQuery(sql.join(conditions, sql` and `)));
  return result.rows.map(toCard);
}

export async function getBoardCard(conn: Conn, proposalId: string): Promise<BoardCard | null> {
  const result = await conn.execute(cardQuery(sql`p.id = ${proposalId}`));
  return result.rows[0] ? toCard(result.rows[0]) : null;
}

/** Locks the proposal row for the rest of the transaction, so two moves of one card are serialised. */
export async function lockProposal(tx: Tx, proposalId: string) {
  const [row] = await tx.select().from(proposals).where(eq(proposals.id, proposalId)).for("update");
  return row ?? null;
}

export async function getFamilyCuratorIds(conn: Conn, familyId: string): Promise<string[]> {
  const rows = await conn.select({ userId: familyCurators.userId }).from(familyCurators).where(eq(familyCurators.familyId, familyId));
  return rows.map((r) => r.userId);
}

export async function getAssignedReviewerIds(conn: Conn, proposalId: string): Promise<string[]> {
  const rows = await conn.select({ id: reviewerAssignments.reviewerId }).from(reviewerAssignments).where(eq(reviewerAssignments.proposalId, proposalId));
  return rows.map((r) => r.id);
}

export async function getLatestRevision(conn: Conn, proposalId: string) {
  const [row] = await conn.select().from(revisions).where(eq(revisions.proposalId, proposalId)).orderBy(desc(revisions.number)).limit(1);
  return row ?? null;
}

export async function getRelease(conn: Conn, id: string) {
  const [row] = await conn.select().from(releases).where(eq(releases.id, id));
  return row ?? null;
}

export async function findFamilyBySlug(conn: Conn, slug: string) {
  const [row] = await conn.select().from(modelFamilies).where(eq(modelFamilies.slug, slug));
  return row ?? null;
}

export async function getFamilyById(conn: Conn, id: string) {
  const [row] = await conn.select().from(modelFamilies).where(eq(modelFamilies.id, id));
  return row ?? null;
}

export function listFamilyReleases(familyId: string) {
  return db
    .select({ id: releases.id, version: releases.version, createdAt: releases.createdAt })
    .from(releases)
    .where(eq(releases.familyId, familyId))
    .orderBy(desc(releases.createdAt));
}

export async function getUserRoles(conn: Conn, id: string): Promise<{ id: string; roles: Role[]; active: boolean } | null> {
  const [row] = await conn.select({ id: users.id, roles: users.roles, active: users.active }).from(users).where(eq(users.id, id));
  return row ?? null;
}

export function listReviewers() {
  return db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.active, true), sql`'reviewer' = any(${users.roles})`))
    .orderBy(asc(users.name));
}

export function listReferenceSets(proposalId: string) {
  return db
    .select({ id: referenceBandSets.id, name: referenceBandSets.name, fileName: referenceBandSets.fileName, sizeBytes: referenceBandSets.sizeBytes, sha256: referenceBandSets.sha256, provenance: referenceBandSets.provenance, parsed: referenceBandSets.parsed, createdAt: referenceBandSets.createdAt })
    .from(referenceBandSets)
    .where(eq(referenceBandSets.proposalId, proposalId))
    .orderBy(asc(referenceBandSets.createdAt));
}

export function listFamiliesWithCurators() {
  return db
    .select({ id: modelFamilies.id, slug: modelFamilies.slug, title: modelFamilies.title, curatorIds: sql<string[]>`coalesce(array_agg(${familyCurators.userId}) filter (where ${familyCurators.userId} is not null), '{}')` })
    .from(modelFamilies)
    .leftJoin(familyCurators, eq(familyCurators.familyId, modelFamilies.id))
    .groupBy(modelFamilies.id)
    .orderBy(modelFamilies.title);
}


export function listRemarks(proposalId: string) {
  return db
    .select({
      id: remarks.id,
      parentId: remarks.parentId,
      body: remarks.body,
      blocking: remarks.blocking,
      anchor: remarks.anchor,
      status: remarks.status,
      version: remarks.version,
      createdAt: remarks.createdAt,
      updatedAt: remarks.updatedAt,
      writerId: remarks.authorId,
      writerName: users.name,
      revision: revisions.number,
    })
    .from(remarks)
    .innerJoin(users, eq(users.id, remarks.authorId))
    .innerJoin(revisions, eq(revisions.id, remarks.revisionId))
    .where(eq(remarks.proposalId, proposalId))
    .orderBy(asc(remarks.createdAt));
}

export async function getRevisionDocument(proposalId: string, number: number) {
  const [row] = await db
    .select({ number: revisions.number, document: revisions.document })
    .from(revisions)
    .where(and(eq(revisions.proposalId, proposalId), eq(revisions.number, number)));
  return row ?? null;
}
