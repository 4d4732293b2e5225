import { db } from "@/db/client";
import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { apiHeaders, loadFamily, parseFamilyParams, releaseDto } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";
import { listReleasesOfFamily } from "@/lib/registry/queries";

export const dynamic = "force-dynamic";

/** GET /api/v1/families/:slug/releases: the family's releases, newest version first. */
export const GET = apiRoute(async (request: Request, ctx: { params: Promise<{ slug: string }> }) => {
  const { slug } = parseFamilyParams(await ctx.params);
  const caller = await authenticateApiRequest(request);
  const family = await loadFamily(slug);
  const releases = await Promise.all((await listReleasesOfFamily(db, family.id)).map((r) => releaseDto(slug, r)));
  return Response.json({ family: { slug: family.slug, title: family.title, dimension: family.dimension }, releases }, { headers: apiHeaders(caller.rate) });
});
