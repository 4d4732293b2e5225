import { z } from "zod";
import { createProposalInput } from "@/board/schemas";
import { createProposal } from "@/board/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseJsonBody } from "@/lib/http";
import { DOCUMENT_BODY_LIMIT } from "@/lib/http-body";

export const dynamic = "force-dynamic";

const body = createProposalInput.extend({ document: z.record(z.string(), z.unknown()).optional() });

/** POST /api/proposals {familySlug, baseReleaseId|null, title, rationale?, document?} — start a proposal (authors). */
export const POST = handleRoute(async (request: Request) => {
  const { document, ...input } = await parseJsonBody(request, body, DOCUMENT_BODY_LIMIT);
  const user = await requireRole("author");
  return Response.json(await createProposal(user, input, document), { status: 201 });
});
