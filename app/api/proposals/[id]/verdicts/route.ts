import { verdictInput } from "@/board/schemas";
import { giveVerdict } from "@/board/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = verdictInput.omit({ proposalId: true });

/** POST /api/proposals/:id/verdicts {verdict, summary} — an assigned reviewer's verdict on the latest revision. */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireRole("reviewer");
  return Response.json(await giveVerdict(user, { ...input, proposalId }), { status: 201 });
});
