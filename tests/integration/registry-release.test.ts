import { and, eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { deprecateRelease, releaseProposal, withdrawRelease } from "@/board/release";
import { prepareRelease } from "@/board/release-draft";
import { db } from "@/db/client";
import { auditEvents, proposals, releaseEvents } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { stopJobQueue } from "@/lib/jobs/boss";
import { getFamilyIdentity, getReleaseMeta } from "@/lib/registry/queries";
import { canonicalJson, documentHash } from "@/lib/tb/canonical";
import { sha256Hex } from "@/lib/tb/sha256";
import { versionOf } from "@/tests/support/board-fixtures";
import { createPerson } from "@/tests/support/people";
import { acceptedProposal, releaseAccepted, releaseRow } from "./registry-world";

afterAll(stopJobQueue);

const codeOf = (p: Promise<unknown>) => p.then(() => "resolved", (e: unknown) => (e instanceof AppError ? e.code : String(e)));

describe("releasing an accepted proposal", () => {
  it("suggests a minor version for changed values and refuses a lower one", async () => {
    const { world, proposalId } = await acceptedProposal();
    const draft = await prepareRelease(db, proposalId);
    expect(draft.assessment.level).toBe("minor");
    expect(draft.suggested).toBe("1.1.0");
    expect(draft.changelog).toContain("shell/A-A/1/sp_sigma");
    expect(await codeOf(releaseAccepted(world, proposalId, "1.0.1"))).toBe("invalid:version");
    expect(await codeOf(releaseAccepted(world, proposalId, "1.0.0"))).toBe("invalid:version");
  });

  it("publishes the document with its sha256, moves the proposal to released, and records event and audit", async () => {
    const { world, proposalId } = await acceptedProposal();
    const { releaseId, version } = await releaseAccepted(world, proposalId, "1.2.0");
    expect(version).toBe("1.2.0");
    const row = await releaseRow(releaseId);
    expect(row.proposalId).toBe(proposalId);
    expect(row.sha256).toBe(documentHash(row.document as never));
    expect(row.sha256).toBe(sha256Hex(canonicalJson(row.document)));
    const [p] = await db.select({ stage: proposals.stage }).from(proposals).where(eq(proposals.id, proposalId));
    expect(p.stage).toBe("released");
    const events = await db.select().from(releaseEvents).where(eq(releaseEvents.releaseId, releaseId));
    expect(events.map((e) => e.kind)).toEqual(["release.published"]);
    const audit = await db.select().from(auditEvents).where(and(eq(auditEvents.subjectId, releaseId), eq(auditEvents.action, "release.published")));
    expect(audit).toHaveLength(1);
    expect(await codeOf(releaseAccepted(world, proposalId, "1.3.0"))).toMatch(/^refused:release|conflict:stale/);
  });

  it("is for curators of the family only", async () => {
    const { world, proposalId } = await acceptedProposal();
    const otherCurator = await createPerson(["curator"]);
    const attempt = async (actor: typeof otherCurator) =>
      releaseProposal(actor, { proposalId, version: await versionOf(proposalId), releaseVersion: "1.1.0", changelog: "not mine to release" });
    expect(await codeOf(attempt(otherCurator))).toBe("forbidden:release");
    expect(await codeOf(attempt(world.author))).toBe("forbidden:release");
  });
});

describe("immutability of releases", () => {
  // The trigger refuses, or (for the app role, which may not delete releases) the missing privilege does.
  const refused = (e: unknown) => /immutable|not allowed|recorded once|permission denied/.test(String((e as { cause?: Error }).cause?.message ?? (e as Error).message));

  it("the database refuses UPDATE of document, version, sha256 and physics hash, and DELETE, whoever connects", async () => {
    const { world, proposalId } = await acceptedProposal();
    const { releaseId } = await releaseAccepted(world, proposalId, "1.1.0");
    for (const change of [
      sql`update releases set version = '9.9.9' where id = ${releaseId}`,
      sql`update releases set sha256 = 'x' where id = ${releaseId}`,
      sql`update releases set physics_hash = 'x' where id = ${releaseId}`,
      sql`update releases set document = jsonb_set(document, '{name}', '"edited"') where id = ${releaseId}`,
      sql`update releases set changelog = 'rewritten' where id = ${releaseId}`,
      sql`delete from releases where id = ${releaseId}`,
    ]) {
      await expect(db.execute(change)).rejects.toSatisfy(refused);
    }
    const row = await releaseRow(releaseId);
    expect(row.version).toBe("1.1.0");
    expect(row.sha256).toBe(documentHash(row.document as never));
  });

  it("lets deprecation be recorded once and never changed afterwards", async () => {
    const { world, proposalId } = await acceptedProposal();
    const { releaseId } = await releaseAccepted(world, proposalId, "1.1.0");
    await db.execute(sql`update releases set deprecated_at = now(), deprecation_reason = 'superseded in a direct update' where id = ${releaseId}`);
    await expect(db.execute(sql`update releases set deprecated_at = null where id = ${releaseId}`)).rejects.toSatisfy(refused);
    await expect(db.execute(sql`update releases set deprecation_reason = 'other words' where id = ${releaseId}`)).rejects.toSatisfy(refused);
  });
});

describe("deprecation and withdrawal", () => {
  it("point latest at the newest release that is neither deprecated nor withdrawn", async () => {
    const { world, proposalId } = await acceptedProposal();
    await releaseAccepted(world, proposalId, "1.1.0");
    const second = await acceptedProposal(world, 2.1);
    await releaseAccepted(world, second.proposalId, "1.2.0");
    const family = (await getFamilyIdentity(db, world.familySlug))!;
    expect((await getReleaseMeta(db, family.id, "latest"))?.version).toBe("1.2.0");

    expect(await codeOf(deprecateRelease(world.curator, { familySlug: world.familySlug, releaseVersion: "1.1.0", reason: "replaced by the refit", successorVersion: "1.0.0" }))).toBe("invalid:successor");
    expect(await codeOf(deprecateRelease(world.author, { familySlug: world.familySlug, releaseVersion: "1.1.0", reason: "not a curator here" }))).toBe("forbidden:release");
    await deprecateRelease(world.curator, { familySlug: world.familySlug, releaseVersion: "1.1.0", reason: "replaced by the refit", successorVersion: "1.2.0" });
    await withdrawRelease(world.curator, { familySlug: world.familySlug, releaseVersion: "1.2.0", reason: "sign error found in sp_sigma" });
    expect(await codeOf(withdrawRelease(world.curator, { familySlug: world.familySlug, releaseVersion: "1.2.0", reason: "sign error found again" }))).toBe("conflict:withdrawn");

    const latest = await getReleaseMeta(db, family.id, "latest");
    expect(latest?.version).toBe("1.0.0");
    const withdrawn = await getReleaseMeta(db, family.id, "1.2.0");
    expect(withdrawn?.withdrawalReason).toBe("sign error found in sp_sigma");
    const kinds = await db.execute<{ kind: string }>(sql`select e.kind from release_events e join releases r on r.id = e.release_id where r.family_id = ${family.id} order by e.created_at`);
    expect(kinds.rows.map((r) => r.kind)).toEqual(["release.published", "release.published", "release.deprecated", "release.withdrawn"]);
  });
});
