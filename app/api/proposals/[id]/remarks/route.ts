import { listRemarks } from "@/board/queries";
import { REMARK_READER_ROLES } from "@/board/remark-rules";
import { createRemarkInput } from "@/board/remark-schemas";
import { createRemark } from "@/board/remarks";
import { requireRole, requireUser } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = createRemarkInput.omit({ proposalId: true });

/** GET /api/proposals/:id/remarks — every remark of every revision, oldest first (review roles, as the workspace). */
export const GET = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  await requireRole(...REMARK_READER_ROLES);
  return Response.json({ remarks: await listRemarks(proposalId) });
});

/** POST /api/proposals/:id/remarks {body, blocking?, anchor, parentId?} — the author, assigned reviewers, family curators. */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireUser();
  return Response.json(await createRemark(user, { ...input, proposalId }), { status: 201 });
});
