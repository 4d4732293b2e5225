import { z } from "zod";
import { uploadReferenceBands } from "@/board/reference-upload";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";
import { REFERENCE_BODY_LIMIT } from "@/lib/http-body";

export const dynamic = "force-dynamic";

const body = z.object({
  name: z.string().trim().min(1, { error: "Name the reference set." }).max(200),
  fileName: z.string().trim().min(1, { error: "Choose a CSV or JSON file." }).max(255),
  content: z.string({ error: "Choose a CSV or JSON file." }),
  // Checked field by field by the upload (REFERENCE_PROVENANCE_SCHEMA); blank fields are left out first.
  provenance: z
    .record(z.string(), z.string())
    .default({})
    .transform((p) => Object.fromEntries(Object.entries(p).flatMap(([k, v]) => (v.trim() ? [[k, v.trim()]] : [])))),
});

/**
 * POST /api/proposals/:id/reference-bands {name, fileName, content, provenance} — reference bands for the author's
 * proposal (the upload form sends the file's text). A body over the file limit is refused before it is read in full.
 */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const input = await parseJsonBody(request, body, REFERENCE_BODY_LIMIT);
  const user = await requireRole("author");
  return Response.json(await uploadReferenceBands(user, { proposalId, ...input }), { status: 201 });
});
