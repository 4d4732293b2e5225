import { waiveInput } from "@/board/schemas";
import { waiveChecks } from "@/board/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = waiveInput.omit({ proposalId: true });

/** POST /api/proposals/:id/waiver {version, reason} — a family curator waives the failing checks of the latest revision. */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireRole("curator");
  return Response.json(await waiveChecks(user, { ...input, proposalId }));
});
