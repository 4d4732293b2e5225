import { z } from "zod";
import { AppError } from "@/lib/errors";
import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { apiHeaders, loadDocument, loadRelease, parseReleaseParams } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";
import { runEngine } from "@/lib/engine-pool/engine";
import { bandsCsv, parseKPointList } from "@/lib/registry/downloads";

export const dynamic = "force-dynamic";

const query = z.object({
  format: z.enum(["json", "csv"]).default("json"),
  k: z.string().max(100_000).optional(),
  points: z.coerce.number().int().min(2).max(5000).optional(),
});

/** GET …/releases/:version/bands: energies on the default path, or at `k` = "k1,k2,k3;…" fractional points. */
export const GET = apiRoute(async (request: Request, ctx: { params: Promise<{ slug: string; version: string }> }) => {
  const { slug, version } = parseReleaseParams(await ctx.params);
  const q = query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!q.success) throw new AppError("invalid:query", "Use format=json|csv, points between 2 and 5000, and k as \"k1,k2,k3;…\".");
  const caller = await authenticateApiRequest(request);
  const { release } = await loadRelease(slug, version);
  const doc = await loadDocument(release.id);
  let bands;
  if (q.data.k !== undefined) {
    const k = parseKPointList(q.data.k, doc.lattice.dimension);
    if (typeof k === "string") throw new AppError("invalid:kpoints", k);
    bands = await runEngine("bandsAtPoints", doc, k);
  } else {
    bands = await runEngine("bandsOnPath", doc, q.data.points);
  }
  const headers = apiHeaders(caller.rate, { "Bandgate-Release-Version": release.version, "Bandgate-Release-Sha256": release.sha256 });
  if (q.data.format === "csv") {
    headers.set("Content-Type", "text/csv; charset=utf-8");
    headers.set("Content-Disposition", `attachment; filename="${slug}-${release.version}-bands.csv"`);
    return new Response(bandsCsv(bands), { headers });
  }
  return Response.json({ family: slug, version: release.version, sha256: release.sha256, units: { energy: "eV", distance: "1/Å" }, ...bands }, { headers });
});
