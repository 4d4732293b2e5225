import "server-only";
import { db } from "@/db/client";
import { getFamilyCuratorIds } from "@/board/queries";
import type { SessionUser } from "@/lib/auth/session-user";
import { serverEnv } from "@/lib/env";
import { runEngine } from "@/lib/engine-pool/engine";
import { releaseCitation } from "@/lib/registry/citation";
import { getFamilyIdentity, getReleaseById, getReleaseWithDocument, listReleasesOfFamily } from "@/lib/registry/queries";
import { compareSemver, parseSemver } from "@/lib/registry/semver";
import { releaseStatus } from "@/lib/registry/status";

/** Everything the release page shows, and whether the viewer may deprecate or withdraw it. */
export async function getReleasePageView(viewer: SessionUser, slug: string, version: string) {
  const family = await getFamilyIdentity(db, slug);
  if (!family || !parseSemver(version)) return null;
  const release = await getReleaseWithDocument(db, family.id, version);
  if (!release) return null;
  const successor = release.successorId ? await getReleaseById(db, release.successorId) : null;
  const newer = (await listReleasesOfFamily(db, family.id)).filter((r) => !r.withdrawnAt && compareSemver(parseSemver(r.version)!, parseSemver(release.version)!) > 0).map((r) => r.version);
  const curators = await getFamilyCuratorIds(db, family.id);
  const pagePath = `/registry/${encodeURIComponent(family.slug)}/${encodeURIComponent(release.version)}`;
  const appUrl = serverEnv().APP_URL.replace(/\/$/, "");
  return {
    family,
    release,
    status: releaseStatus(release),
    successorVersion: successor?.version ?? null,
    newerVersions: newer,
    model: await runEngine("modelView", release.document),
    mayCurate: viewer.roles.includes("curator") && curators.includes(viewer.id),
    appUrl,
    pagePath,
    citation: releaseCitation({ familyTitle: family.title, familySlug: family.slug, version: release.version, sha256: release.sha256, releasedAt: release.createdAt, url: appUrl + pagePath }),
  };
}

/** The pull command the README documents: download with a token, then compare the checksum. */
export function pullCommand(appUrl: string, slug: string, version: string): string {
  const file = `${slug}-${version}.json`;
  return [
    `curl -fsS -H "Authorization: Bearer $BANDGATE_TOKEN" -o ${file} \\`,
    `  ${appUrl}/api/v1/families/${slug}/releases/${version}/document`,
    `sha256sum ${file}`,
  ].join("\n");
}
