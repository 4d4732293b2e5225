import { db } from "@/db/client";
import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { AppError } from "@/lib/errors";
import { getFitRun } from "@/lib/fits/queries";
import { fitRunView } from "@/lib/fits/view";
import { handleRoute, parseIdParam } from "@/lib/http";

export const dynamic = "force-dynamic";

/** GET /api/fits/:id — one refit's status and progress (poll it while it runs). */
export const GET = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const fitId = parseIdParam((await params).id, "fit");
  await requireRole(...BOARD_ROLES);
  const row = await getFitRun(db, fitId);
  if (!row) throw new AppError("not-found:fit", "That refit does not exist.");
  const { run } = row;
  return Response.json({
    fit: fitRunView(row),
    spec: run.spec,
    outcome: run.outcome,
    record: { proposalId: run.proposalId, baseRevisionId: run.baseRevisionId, referenceSetId: run.referenceSetId, engineVersion: run.engineVersion, costHistory: run.costHistory },
  });
});
