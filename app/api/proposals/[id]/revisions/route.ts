import { saveRevisionInput } from "@/board/schemas";
import { saveRevision } from "@/board/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";
import { DOCUMENT_BODY_LIMIT } from "@/lib/http-body";

export const dynamic = "force-dynamic";

const body = saveRevisionInput.omit({ proposalId: true });

/** POST /api/proposals/:id/revisions {version, document, note?} — a new revision by the author (draft or revision stage). */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body, DOCUMENT_BODY_LIMIT);
  const user = await requireRole("author");
  return Response.json(await saveRevision(user, { ...input, proposalId }), { status: 201 });
});
