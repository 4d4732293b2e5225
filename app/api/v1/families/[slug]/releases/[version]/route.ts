import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { apiHeaders, loadRelease, parseReleaseParams, releaseDto } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";

export const dynamic = "force-dynamic";

/** GET /api/v1/families/:slug/releases/:version ("latest" allowed): checksum, status, changelog and links. */
export const GET = apiRoute(async (request: Request, ctx: { params: Promise<{ slug: string; version: string }> }) => {
  const { slug, version } = parseReleaseParams(await ctx.params);
  const caller = await authenticateApiRequest(request);
  const { release } = await loadRelease(slug, version);
  return Response.json(await releaseDto(slug, release), { headers: apiHeaders(caller.rate) });
});
