import { inviteInput } from "@/lib/accounts/schemas";
import { inviteUser } from "@/lib/accounts/service";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute, parseJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

/** POST /api/admin/invitations — invite a person (admin only). */
export const POST = handleRoute(async (request: Request) => {
  const input = await parseJsonBody(request, inviteInput);
  const actor = await requireRole("admin");
  const result = await inviteUser(actor, input);
  return Response.json(result, { status: 201 });
});
