import { listUsers } from "@/lib/accounts/queries";
import { requireRole } from "@/lib/auth/guard";
import { handleRoute } from "@/lib/http";

export const dynamic = "force-dynamic";

/** GET /api/admin/users — everyone with an account (admin only); never password hashes. */
export const GET = handleRoute(async () => {
  await requireRole("admin");
  return Response.json({ users: await listUsers() });
});
