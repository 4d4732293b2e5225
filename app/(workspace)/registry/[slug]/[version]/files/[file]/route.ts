import { z } from "zod";
import { db } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { handleRoute } from "@/lib/http";
import { runEngine } from "@/lib/engine-pool/engine";
import { bandsCsv, hoppingsCsv } from "@/lib/registry/downloads";
import { getFamilyIdentity, getReleaseWithDocument } from "@/lib/registry/queries";
import { canonicalJson } from "@/lib/tb/canonical";
import { parseModelDocument } from "@/lib/tb/document";

export const dynamic = "force-dynamic";

const params = z.object({
  slug: z.string().min(1).max(200),
  version: z.string().regex(/^\d{1,6}\.\d{1,6}\.\d{1,6}$/),
  file: z.enum(["model-document.json", "hoppings.json", "hoppings.csv", "bands.csv"]),
});

/** Downloads on the release page, for signed-in people (simulation codes use API v1 with a token). */
export const GET = handleRoute(async (_request: Request, ctx: { params: Promise<Record<string, string>> }) => {
  const parsed = params.safeParse(await ctx.params);
  if (!parsed.success) throw new AppError("not-found:file", "No such download.");
  await requireUser();
  const { slug, version, file } = parsed.data;
  const family = await getFamilyIdentity(db, slug);
  const release = family ? await getReleaseWithDocument(db, family.id, version) : null;
  if (!release) throw new AppError("not-found:release", "No such release.");
  const name = `${slug}-${version}-${file}`;
  const send = (body: string, type: string) =>
    new Response(body, { headers: { "Content-Type": `${type}; charset=utf-8`, "Content-Disposition": `attachment; filename="${name}"`, ETag: `"${release.sha256}-${file}"` } });
  if (file === "model-document.json") return send(canonicalJson(release.document), "application/json");
  const doc = parseModelDocument(release.document);
  if (file === "bands.csv") return send(bandsCsv(await runEngine("bandsOnPath", doc)), "text/csv");
  const hoppings = await runEngine("hoppings", doc);
  return file === "hoppings.csv" ? send(hoppingsCsv(hoppings), "text/csv") : send(JSON.stringify({ family: slug, version, sha256: release.sha256, hoppings }, null, 2), "application/json");
});
