import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { previewFit } from "@/lib/fits/service";
import { handleRoute, parseIdParam, readJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

/** POST /api/proposals/:id/fits/preview {fit settings} — which bands and k-points would enter, with what weight. */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  await requireRole(...BOARD_ROLES);
  const body = await readJsonBody(request);
  return Response.json(await previewFit(proposalId, body));
});
