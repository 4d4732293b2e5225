import { assignInput } from "@/board/schemas";
import { assignReviewer, unassignReviewer } from "@/board/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = assignInput.omit({ proposalId: true });

/** POST /api/proposals/:id/reviewers {version, reviewerId} — a family curator assigns a reviewer. */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireRole("curator");
  return Response.json(await assignReviewer(user, { ...input, proposalId }), { status: 201 });
});

/** DELETE /api/proposals/:id/reviewers {version, reviewerId} — a family curator removes a reviewer. */
export const DELETE = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireRole("curator");
  return Response.json(await unassignReviewer(user, { ...input, proposalId }));
});
