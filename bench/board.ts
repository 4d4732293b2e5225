import { performance } from "node:perf_hooks";
import { sql } from "drizzle-orm";
import { listBoardCards } from "@/board/queries";
import { db } from "@/db/client";
import { modelFamilies, proposals, releases, reviewerAssignments, revisions, users, verdicts } from "@/db/schema";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { blankModelDocument } from "@/lib/tb/blank-document";

const PROPOSALS = 1000;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

async function timeIt(runs: number, fn: () => Promise<unknown>): Promise<number> {
  await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  return median(times);
}

/** A board of 1,000 proposals (with revisions, reviewers and verdicts) in a scratch database. */
async function fillBoard(): Promise<string> {
  const doc = blankModelDocument(1);
  const [author] = await db.insert(users).values({ email: `bench-${Date.now()}@bench.invalid`, name: "Bench author", roles: ["author", "reviewer"] }).returning({ id: users.id });
  const [reviewer] = await db.insert(users).values({ email: `bench-r-${Date.now()}@bench.invalid`, name: "Bench reviewer", roles: ["reviewer"] }).returning({ id: users.id });
  const slug = `bench-${Date.now()}`;
  const [family] = await db.insert(modelFamilies).values({ slug, title: "Bench family", description: "", dimension: 1 }).returning({ id: modelFamilies.id });
  const [release] = await db.insert(releases).values({ familyId: family.id, version: "1.0.0", document: doc, sha256: documentHash(doc), physicsHash: physicsHash(doc), changelog: "bench" }).returning({ id: releases.id });
  const stages = ["draft", "submitted", "under_review", "revision", "accepted", "declined"] as const;
  const rows = await db
    .insert(proposals)
    .values(Array.from({ length: PROPOSALS }, (_, i) => ({ familyId: family.id, baseReleaseId: release.id, authorId: author.id, title: `Bench proposal ${i}`, stage: stages[i % stages.length] })))
    .returning({ id: proposals.id });
  for (let number = 1; number <= 2; number++) {
    await db.insert(revisions).values(
      rows.map((p) => ({ proposalId: p.id, number, document: doc, sha256: `s${number}`, physicsHash: `p${number}`, checkResults: [{ id: "x", status: "pass" }], checksPassing: true, shiftProfile: Array.from({ length: 48 }, (_, k) => k / 48), maxShift: 1, createdBy: author.id })),
    );
  }
  await db.insert(reviewerAssignments).values(rows.map((p) => ({ proposalId: p.id, reviewerId: reviewer.id, assignedBy: author.id })));
  const revs = await db.execute(sql`select id, proposal_id from revisions where number = 2 and proposal_id in (select id from proposals where family_id = ${family.id})`);
  await db.insert(verdicts).values(revs.rows.map((r) => ({ proposalId: String(r.proposal_id), revisionId: String(r.id), reviewerId: reviewer.id, verdict: "accept" as const, summary: "ok", physicsHash: "p2" })));
  return slug;
}

export async function runBoardBench(): Promise<void> {
  if (!process.env.DATABASE_URL) {
    console.log("board benchmark skipped: no DATABASE_URL (run it through `npm run bench`)");
    return;
  }
  const slug = await fillBoard();
  const viewer = (await db.execute(sql`select id from users limit 1`)).rows[0].id as string;
  const reference = await timeIt(15, () => db.execute(sql`select * from proposals where family_id = (select id from model_families where slug = ${slug})`));
  const board = await timeIt(15, () => listBoardCards({ family: [slug], stage: [] }, viewer));
  const filtered = await timeIt(15, () => listBoardCards({ family: [slug], stage: ["under_review"] }, viewer));
  console.log(`board: ${PROPOSALS} proposals with revisions, reviewers and verdicts (median of 15, ms; ratio against a plain select of the same proposals)`);
  console.log(`  all cards        ${board.toFixed(1).padStart(7)}   ${(board / reference).toFixed(1)}×   (plain select ${reference.toFixed(1)} ms)`);
  console.log(`  one stage        ${filtered.toFixed(1).padStart(7)}   ${(filtered / reference).toFixed(1)}×`);
}
