import "server-only";
import { eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { modelFamilies, releaseEvents, releases } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { hasAnyRole } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { enqueueReleaseEvent } from "@/lib/jobs/boss";
import type { ReleaseEventKind } from "@/lib/registry/events";
import { getFamilyIdentity, lockRelease } from "@/lib/registry/queries";
import type { DeprecateInput, ReleaseInput, WithdrawInput } from "@/lib/registry/schemas";
import { compareSemver, parseSemver } from "@/lib/registry/semver";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { storeMarkdownHtml } from "./markdown-html";
import { prepareRelease } from "./release-draft";
import { moveProposal } from "./service";
import { getFamilyCuratorIds } from "./queries";

async function assertCurator(tx: Tx, actor: SessionUser, familyId: string): Promise<void> {
  if (!hasAnyRole(actor.roles, ["curator"]) || !(await getFamilyCuratorIds(tx, familyId)).includes(actor.id)) {
    throw new AppError("forbidden:release", "Only a curator of this family may release, deprecate or withdraw its versions.");
  }
}

async function addEvent(tx: Tx, actor: SessionUser, releaseId: string, kind: ReleaseEventKind): Promise<string> {
  const [event] = await tx.insert(releaseEvents).values({ releaseId, kind, actorId: actor.id }).returning({ id: releaseEvents.id });
  return event.id;
}

/**
 * A family curator turns an accepted proposal into an immutable release: the latest revision's document with its
 * sha256, a version at least the suggested one, and the changelog. The release, the move to "released", the event
 * and the audit entry commit together; subscribers are told afterwards by the worker.
 */
export async function releaseProposal(actor: SessionUser, input: ReleaseInput): Promise<{ releaseId: string; familySlug: string; version: string }> {
  const result = await db.transaction(async (tx) => {
    const prepared = await prepareRelease(tx, input.proposalId, { lockFamily: true });
    await assertCurator(tx, actor, prepared.familyId);
    if (prepared.stage !== "accepted") throw new AppError("refused:release", "Only an accepted proposal can be released.");
    const problem = prepared.versionProblem(input.releaseVersion);
    if (problem) throw new AppError("invalid:version", problem, { releaseVersion: [problem] });
    const doc = prepared.document;
    const [release] = await tx
      .insert(releases)
      .values({ familyId: prepared.familyId, version: input.releaseVersion, document: doc, sha256: documentHash(doc), physicsHash: physicsHash(doc), changelog: input.changelog, proposalId: input.proposalId, releasedBy: actor.id })
      .returning({ id: releases.id, sha256: releases.sha256 });
    await moveProposal(actor, { proposalId: input.proposalId, version: input.version, to: "released" }, { viaRelease: true, tx });
    const eventId = await addEvent(tx, actor, release.id, "release.published");
    await recordAudit(tx, {
      actorId: actor.id,
      action: "release.published",
      subjectType: "release",
      subjectId: release.id,
      after: { family: prepared.familySlug, version: input.releaseVersion, sha256: release.sha256, proposalId: input.proposalId, suggested: prepared.suggested, level: prepared.assessment.level },
    });
    return { releaseId: release.id, familySlug: prepared.familySlug, version: input.releaseVersion, eventId };
  });
  await enqueueReleaseEvent(result.eventId);
  await storeMarkdownHtml(input.changelog);
  return { releaseId: result.releaseId, familySlug: result.familySlug, version: result.version };
}

async function lockFamilyRelease(tx: Tx, actor: SessionUser, familySlug: string, version: string) {
  const family = await getFamilyIdentity(tx, familySlug);
  if (!family) throw new AppError("not-found:family", "That model family does not exist.");
  await assertCurator(tx, actor, family.id);
  const release = await lockRelease(tx, family.id, version);
  if (!release) throw new AppError("not-found:release", `Release ${version} does not exist.`);
  return { family, release };
}

/** Marks a release deprecated, with a reason and optionally its successor (a newer release of the same family). */
export async function deprecateRelease(actor: SessionUser, input: DeprecateInput): Promise<void> {
  const eventId = await db.transaction(async (tx) => {
    await tx.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, input.familySlug)).for("update");
    const { family, release } = await lockFamilyRelease(tx, actor, input.familySlug, input.releaseVersion);
    if (release.deprecatedAt) throw new AppError("conflict:deprecated", `Release ${release.version} is already deprecated.`);
    let successorId: string | null = null;
    if (input.successorVersion) {
      const successor = await lockRelease(tx, family.id, input.successorVersion);
      const newer = successor && compareSemver(parseSemver(successor.version)!, parseSemver(release.version)!) > 0;
      if (!successor || !newer || successor.withdrawnAt) {
        const msg = "The successor must be a newer release of the same family that is not withdrawn.";
        throw new AppError("invalid:successor", msg, { successorVersion: [msg] });
      }
      successorId = successor.id;
    }
    await tx.update(releases).set({ deprecatedAt: new Date(), deprecationReason: input.reason, successorId }).where(eq(releases.id, release.id));
    await recordAudit(tx, { actorId: actor.id, action: "release.deprecated", subjectType: "release", subjectId: release.id, after: { version: release.version, reason: input.reason, successor: input.successorVersion ?? null } });
    return addEvent(tx, actor, release.id, "release.deprecated");
  });
  await enqueueReleaseEvent(eventId);
}

/** Withdraws a release: it stays readable, flagged, and "latest" no longer points at it. */
export async function withdrawRelease(actor: SessionUser, input: WithdrawInput): Promise<void> {
  const eventId = await db.transaction(async (tx) => {
    const { release } = await lockFamilyRelease(tx, actor, input.familySlug, input.releaseVersion);
    if (release.withdrawnAt) throw new AppError("conflict:withdrawn", `Release ${release.version} is already withdrawn.`);
    await tx.update(releases).set({ withdrawnAt: new Date(), withdrawalReason: input.reason }).where(eq(releases.id, release.id));
    await recordAudit(tx, { actorId: actor.id, action: "release.withdrawn", subjectType: "release", subjectId: release.id, after: { version: release.version, reason: input.reason } });
    return addEvent(tx, actor, release.id, "release.withdrawn");
  });
  await enqueueReleaseEvent(eventId);
}
