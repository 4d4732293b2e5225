import "server-only";
import { and, eq } from "drizzle-orm";
import type { Conn } from "@/db/client";
import { proposals, referenceBandSets, revisions } from "@/db/schema";
import { getAssignedReviewerIds, getFamilyCuratorIds, getLatestRevision } from "@/board/queries";
import { parseDocument } from "@/board/revision-facts";
import { AppError } from "@/lib/errors";
import { runEngine } from "@/lib/engine-pool/engine";
import type { ModelDocument } from "@/lib/tb/document";
import { listParameters } from "@/lib/tb/parameters";
import type { FitPreview } from "./preview";
import type { StoredReference } from "./problem";
import type { FitSpec } from "./spec";

/** Everything a refit starts from: the proposal's people, the revision to start at, the reference set. */
export interface FitContext {
  proposal: typeof proposals.$inferSelect;
  facts: { stage: (typeof proposals.$inferSelect)["stage"]; authorId: string; familyCuratorIds: string[]; assignedReviewerIds: string[] };
  revision: typeof revisions.$inferSelect;
  document: ModelDocument;
  reference: typeof referenceBandSets.$inferSelect;
  parsedReference: StoredReference;
}

export async function loadFitContext(conn: Conn, proposalId: string, referenceSetId: string, revisionId?: string): Promise<FitContext> {
  const [proposal] = await conn.select().from(proposals).where(eq(proposals.id, proposalId));
  if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
  const revision = revisionId
    ? ((await conn.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.proposalId, proposalId))))[0] ?? null)
    : await getLatestRevision(conn, proposalId);
  if (!revision) throw new AppError("not-found:revision", "This proposal has no revision to fit.");
  const parsed = parseDocument(revision.document);
  if (!parsed.ok) throw new AppError("refused:fit-input", `Revision ${revision.number} is not a valid model document, so it cannot be fitted.`);
  const [reference] = await conn
    .select()
    .from(referenceBandSets)
    .where(and(eq(referenceBandSets.id, referenceSetId), eq(referenceBandSets.proposalId, proposalId)));
  if (!reference) {
    throw new AppError("invalid:input", "That reference band set is not attached to this proposal.", { referenceSetId: ["Choose one of this proposal's reference sets."] });
  }
  const familyCuratorIds = await getFamilyCuratorIds(conn, proposal.familyId);
  const assignedReviewerIds = await getAssignedReviewerIds(conn, proposal.id);
  return {
    proposal,
    facts: { stage: proposal.stage, authorId: proposal.authorId, familyCuratorIds, assignedReviewerIds },
    revision,
    document: parsed.doc,
    reference,
    parsedReference: reference.parsed as StoredReference,
  };
}

/**
 * The preview doubles as the input check: anything the engine would refuse is refused here, before a job exists.
 * It is computed on an engine thread (it evaluates the bands and their derivatives at every reference point).
 */
export async function checkedPreview(ctx: FitContext, spec: FitSpec): Promise<FitPreview> {
  const result = await runEngine("fitPreview", ctx.document, ctx.parsedReference, spec);
  if (result.ok) return result.preview;
  const message = inWords(result.message.replace(/^fit: /, ""), ctx.document);
  throw new AppError("refused:fit-input", `This refit cannot start: ${message}.`, undefined, { reasons: [message] });
}

/** Engine messages name parameters by key and open bounds as Infinity; people read labels and ∞. */
function inWords(message: string, doc: ModelDocument): string {
  let out = message.replace(/-Infinity/g, "−∞").replace(/Infinity/g, "+∞");
  // Longest keys first, so onsite/X/s* is not read as onsite/X/s followed by "*".
  for (const p of listParameters(doc).sort((a, b) => b.key.length - a.key.length)) out = out.split(p.key).join(p.label);
  return out;
}
