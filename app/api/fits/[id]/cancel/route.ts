import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { cancelFit } from "@/lib/fits/service";
import { handleRoute, parseIdParam } from "@/lib/http";

export const dynamic = "force-dynamic";

/** POST /api/fits/:id/cancel — stops a waiting or running refit (its starter or an admin); a running one keeps its best point. */
export const POST = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const fitId = parseIdParam((await params).id, "fit");
  const user = await requireRole(...BOARD_ROLES);
  return Response.json(await cancelFit(user, fitId));
});
