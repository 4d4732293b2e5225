import { listRemarks } from "@/board/queries";
import { createRemarkInput } from "@/board/remark-schemas";
import { createRemark } from "@/board/remarks";
import { requireRole, requireUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = createRemarkInput.omit({ proposalId: true });

/** GET /api/proposals/:id/remarks — every remark of every revision, oldest first. */
export const GET = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  await requireRole(...BOARD_ROLES);
  return Response.json({ remarks: await listRemarks(proposalId) });
});

/** POST /api/proposals/:id/remarks {body, blocking?, anchor, parentId?} */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body);
  const user = await requireUser();
  return Response.json(await createRemark(user, { ...input, proposalId }), { status: 201 });
});
