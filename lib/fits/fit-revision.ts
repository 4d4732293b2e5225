import "server-only";
import type { FitRun } from "@/db/schema";
import { prepareRevision, type PreparedRevision } from "@/board/revision-intake";
import { runEngine } from "@/lib/engine-pool/engine";
import type { ModelDocument } from "@/lib/tb/document";
import type { FitContext } from "./context";
import type { FitOutcome } from "./record";

/**
 * The revision a fit's outcome becomes when saved on top of `onto` (its start revision, or a later one that keeps
 * what the fit held fixed): the document and its facts, computed on an engine thread before any row is locked.
 */
export async function prepareFitRevision(ctx: FitContext, run: Pick<FitRun, "id" | "spec">, onto: ModelDocument, outcome: FitOutcome): Promise<PreparedRevision> {
  const info = { name: ctx.reference.name, provenance: ctx.reference.provenance };
  const doc = await runEngine("fittedDocument", ctx.document, onto, ctx.parsedReference, run.spec, outcome, info, run.id);
  return prepareRevision(ctx.proposal, doc);
}
