import { db } from "@/db/client";
import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { listFitRuns } from "@/lib/fits/queries";
import { startFit } from "@/lib/fits/service";
import { fitRunView } from "@/lib/fits/view";
import { handleRoute, parseIdParam, readJsonBody } from "@/lib/http";

export const dynamic = "force-dynamic";

/** GET /api/proposals/:id/fits — the proposal's refits, newest first, with progress. */
export const GET = handleRoute(async (_request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  await requireRole(...BOARD_ROLES);
  const rows = await listFitRuns(db, proposalId);
  const byId = new Map(rows.map((r) => [r.run.id, r.run]));
  const now = Date.now();
  return Response.json({ fits: rows.map((r) => fitRunView(r, now, r.run.rerunOf ? byId.get(r.run.rerunOf) : null)) });
});

/** POST /api/proposals/:id/fits {fit settings} — starts a refit as a background job (author, draft or revision stage). */
export const POST = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const user = await requireRole("author");
  const body = await readJsonBody(request);
  return Response.json(await startFit(user, proposalId, body), { status: 202 });
});
