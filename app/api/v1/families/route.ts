import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { apiHeaders, releasePath } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";
import { listRegistryFamilies } from "@/lib/registry/queries";

export const dynamic = "force-dynamic";

/** GET /api/v1/families: every model family with its latest current release. */
export const GET = apiRoute(async (request: Request) => {
  const caller = await authenticateApiRequest(request);
  const families = await listRegistryFamilies();
  const dto = families.map((f) => ({
    slug: f.slug,
    title: f.title,
    description: f.description,
    dimension: f.dimension,
    releases: f.releases,
    latest: f.version ? { version: f.version, sha256: f.sha256, releasedAt: f.releasedAt?.toISOString() ?? null, links: { self: releasePath(f.slug, f.version) } } : null,
  }));
  return Response.json({ families: dto }, { headers: apiHeaders(caller.rate) });
});
