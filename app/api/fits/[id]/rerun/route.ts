import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { rerunFit } from "@/lib/fits/service";
import { handleRoute, parseIdParam } from "@/lib/http";

export const dynamic = "force-dynamic";

/** POST /api/fits/:id/rerun — runs a stored fit record again, to check that it reproduces (never becomes a revision). */
export const POST = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const fitId = parseIdParam((await params).id, "fit");
  const user = await requireRole(...BOARD_ROLES);
  return Response.json(await rerunFit(user, fitId), { status: 202 });
});
