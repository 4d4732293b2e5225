import { z } from "zod";
import { editRemarkInput, remarkActionInput } from "@/board/remark-schemas";
import { actOnRemark, editRemark } from "@/board/remarks";
import { requireUser } from "@/lib/auth/guard";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const patch = z.union([remarkActionInput.omit({ remarkId: true }).strict(), editRemarkInput.omit({ remarkId: true }).strict()]);

/** PATCH /api/remarks/:id — {version, action: address|resolve|reopen} or {version, body} (edit by its writer). */
export const PATCH = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const remarkId = parseIdParam((await params).id, "remark");
  const input = await parseJsonBody(request, patch);
  const user = await requireUser();
  if ("action" in input) return Response.json(await actOnRemark(user, { ...input, remarkId }));
  await editRemark(user, { ...input, remarkId });
  return Response.json({ ok: true });
});
