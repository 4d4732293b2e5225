import { z } from "zod";
import { AppError } from "@/lib/errors";
import { authenticateApiRequest } from "@/lib/registry/api-auth";
import { apiHeaders, loadDocument, loadRelease, parseReleaseParams } from "@/lib/registry/api-load";
import { apiRoute } from "@/lib/registry/api-route";
import { runEngine } from "@/lib/engine-pool/engine";
import { hoppingsCsv } from "@/lib/registry/downloads";

export const dynamic = "force-dynamic";

const query = z.object({ format: z.enum(["json", "csv"]).default("json") });

/** GET …/releases/:version/hoppings?format=json|csv: the real-space hopping list H_ij(R), on-site terms included. */
export const GET = apiRoute(async (request: Request, ctx: { params: Promise<{ slug: string; version: string }> }) => {
  const { slug, version } = parseReleaseParams(await ctx.params);
  const q = query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!q.success) throw new AppError("invalid:format", "format must be json or csv.");
  const caller = await authenticateApiRequest(request);
  const { release } = await loadRelease(slug, version);
  const hoppings = await runEngine("hoppings", await loadDocument(release.id));
  const headers = apiHeaders(caller.rate, { "Bandgate-Release-Version": release.version, "Bandgate-Release-Sha256": release.sha256 });
  if (q.data.format === "csv") {
    headers.set("Content-Type", "text/csv; charset=utf-8");
    headers.set("Content-Disposition", `attachment; filename="${slug}-${release.version}-hoppings.csv"`);
    return new Response(hoppingsCsv(hoppings), { headers });
  }
  return Response.json({ family: slug, version: release.version, sha256: release.sha256, units: { energy: "eV", length: "Å" }, hoppings }, { headers });
});
