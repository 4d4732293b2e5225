import { requireRole } from "@/lib/auth/guard";
import { applyFit } from "@/lib/fits/service";
import { handleRoute, parseIdParam, readJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

/** POST /api/fits/:id/apply {version} — saves a finished refit's best point as the proposal's next revision (author). */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const fitId = parseIdParam((await params).id, "fit");
  const user = await requireRole("author");
  const body = await readJsonBody(request);
  return Response.json(await applyFit(user, fitId, body), { status: 201 });
});
