import { z } from "zod";
import { changeRolesInput, setActiveInput } from "@/lib/accounts/schemas";
import { changeRoles, setActive } from "@/lib/accounts/service";
import { requireRole } from "@/lib/auth/guard";
import { renewOwnSession } from "@/lib/auth/session-cookie";
import { handleRoute, parseIdParam, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

const patchBody = z.union([
  changeRolesInput.omit({ userId: true }).strict(),
  setActiveInput.omit({ userId: true }).extend({ active: z.boolean() }).strict(),
]);

/** PATCH /api/admin/users/:id — body {roles, version} or {active, version} (admin only, optimistic concurrency). */
export const PATCH = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const id = parseIdParam((await params).id, "user");
  const body = await parseJsonBody(request, patchBody);
  const actor = await requireRole("admin");
  if ("roles" in body) {
    const { sessionVersion } = await changeRoles(actor, changeRolesInput.parse({ ...body, userId: id }));
    if (id === actor.id) await renewOwnSession(sessionVersion);
  } else await setActive(actor, setActiveInput.parse({ ...body, userId: id }));
  return Response.json({ ok: true });
});
