import { z } from "zod";
import { getBoardCard } from "@/board/queries";
import { moveInput } from "@/board/schemas";
import { moveProposal } from "@/board/service";
import { db } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const body = moveInput.omit({ proposalId: true });

/** POST /api/proposals/:id/moves {version, to, reason?} — 200 with the moved card; 403, 404, 409 (stale, with the current card), 422 (gate). */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input: z.infer<typeof body> = await parseJsonBody(request, body);
  const user = await requireUser();
  await moveProposal(user, { ...input, proposalId });
  return Response.json({ card: await getBoardCard(db, proposalId) });
});
