import { getProposalView } from "@/board/proposal-view";
import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { AppError, fieldErrorsOf } from "@/lib/errors";
import { runEngine } from "@/lib/engine-pool/engine";
import { handleRoute, parseIdParam } from "@/lib/http";
import type { ParsedReferenceBands } from "@/lib/reference-bands";
import { metricsQuerySchema } from "@/lib/review/metrics-query";

export const dynamic = "force-dynamic";

/** GET /api/proposals/:id/metrics?alignment=&window=lo,hi — the review workspace's metrics table for other settings. */
export const GET = handleRoute(async (request: Request, { params }: { params: Promise<{ id: string }> }) => {
  const proposalId = parseIdParam((await params).id, "proposal");
  const user = await requireRole(...BOARD_ROLES);
  const query = metricsQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw new AppError("invalid:input", "The metrics settings have problems.", fieldErrorsOf(query.error));
  const view = await getProposalView(proposalId, user);
  if (!view || !view.latestDocument) throw new AppError("not-found:proposal", "That proposal does not exist or has no valid revision.");
  const first = view.references[0];
  const reference = first ? { id: first.id, name: first.name, parsed: first.parsed as ParsedReferenceBands & { pointsTotal?: number } } : null;
  return Response.json({ rows: await runEngine("metrics", view.latestDocument, view.baseDocument, reference, query.data) });
});
