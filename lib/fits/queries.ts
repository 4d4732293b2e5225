import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Conn, Database } from "@/db/client";
import { fitRuns, referenceBandSets, revisions, users } from "@/db/schema";
import { ACTIVE_FIT_STATUSES } from "./record";

const baseRevision = alias(revisions, "base_revision");
const resultRevision = alias(revisions, "result_revision");

/** A fit run with the names a page shows beside it. */
function selectRuns(conn: Conn) {
  return (conn as Database)
    .select({
      run: fitRuns,
      startedByName: users.name,
      referenceName: referenceBandSets.name,
      baseRevisionNumber: baseRevision.number,
      resultRevisionNumber: resultRevision.number,
    })
    .from(fitRuns)
    .innerJoin(users, eq(users.id, fitRuns.startedBy))
    .innerJoin(referenceBandSets, eq(referenceBandSets.id, fitRuns.referenceSetId))
    .innerJoin(baseRevision, eq(baseRevision.id, fitRuns.baseRevisionId))
    .leftJoin(resultRevision, eq(resultRevision.id, fitRuns.resultRevisionId));
}

export type FitRunRow = NonNullable<Awaited<ReturnType<typeof getFitRun>>>;

export async function listFitRuns(conn: Conn, proposalId: string, limit = 50) {
  return selectRuns(conn).where(eq(fitRuns.proposalId, proposalId)).orderBy(desc(fitRuns.createdAt)).limit(limit);
}

export async function getFitRun(conn: Conn, fitId: string) {
  const [row] = await selectRuns(conn).where(eq(fitRuns.id, fitId));
  return row ?? null;
}

/** The fit that produced a revision, if one did. */
export async function getFitOfRevision(conn: Conn, revisionId: string) {
  const [row] = await selectRuns(conn).where(eq(fitRuns.resultRevisionId, revisionId));
  return row ?? null;
}

export async function countActiveFits(conn: Conn, userId: string): Promise<number> {
  const [row] = await conn
    .select({ n: sql<number>`count(*)::int` })
    .from(fitRuns)
    .where(and(eq(fitRuns.startedBy, userId), inArray(fitRuns.status, [...ACTIVE_FIT_STATUSES])));
  return row?.n ?? 0;
}

/** Re-runs of a stored fit (reproducibility checks), newest first. */
export async function listReruns(conn: Conn, fitId: string) {
  return selectRuns(conn).where(eq(fitRuns.rerunOf, fitId)).orderBy(desc(fitRuns.createdAt));
}
