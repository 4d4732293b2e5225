import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { db } from "@/db/client";
import { apiHeaders, loadRelease, parseReleaseParams } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";
import { ifNoneMatchHits, releaseEtag } from "@/lib/registry/etag";
import { getReleaseDocument } from "@/lib/registry/queries";
import { releaseStatus } from "@/lib/registry/status";
import { canonicalJson } from "@/lib/tb/canonical";

export const dynamic = "force-dynamic";

/**
 * GET …/releases/:version/document: the canonical text of the model document, so sha256(body) is the release
 * checksum. ETag is that checksum; a matching If-None-Match gets 304 without the document being read.
 */
export const GET = apiRoute(async (request: Request, ctx: { params: Promise<{ slug: string; version: string }> }) => {
  const { slug, version } = parseReleaseParams(await ctx.params);
  const caller = await authenticateApiRequest(request);
  const { release } = await loadRelease(slug, version);
  const etag = releaseEtag(release.sha256);
  const headers = apiHeaders(caller.rate, {
    ETag: etag,
    "Bandgate-Release-Version": release.version,
    "Bandgate-Release-Status": releaseStatus(release),
  });
  if (ifNoneMatchHits(request.headers.get("if-none-match"), etag)) return new Response(null, { status: 304, headers });
  // Served as stored (it was validated when released), not re-parsed: the bytes must hash to the checksum.
  const body = canonicalJson(await getReleaseDocument(db, release.id));
  headers.set("Content-Type", "application/json; charset=utf-8");
  headers.set("Content-Disposition", `inline; filename="${slug}-${release.version}.json"`);
  return new Response(body, { status: 200, headers });
});
