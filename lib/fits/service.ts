import "server-only";
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type Tx } from "@/db/client";
import { fitRuns } from "@/db/schema";
import { decideApplyFit, decideCancelFit, decideRerunFit, decideStartFit } from "@/board/fit-rules";
import { getLatestRevision, lockProposal } from "@/board/queries";
import { parseDocument } from "@/board/revision-facts";
import { appendRevision, enforce } from "@/board/service";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError, fieldErrorsOf } from "@/lib/errors";
import { enqueueFit, jobQueue } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import type { ModelDocument } from "@/lib/tb/document";
import { listParameters } from "@/lib/tb/parameters";
import { TB_ENGINE_VERSION } from "@/lib/tb/version";
import { fitStillApplies } from "./apply-onto";
import { checkedPreview, loadFitContext } from "./context";
import type { FitPreview } from "./preview";
import { countActiveFits, getFitRun } from "./queries";
import { fitRevisionNote } from "./record";
import { prepareFitRevision } from "./fit-revision";
import { fitSpecSchema, type FitSpec } from "./spec";

export function parseFitSpec(input: unknown): FitSpec {
  const parsed = fitSpecSchema.safeParse(input);
  if (!parsed.success) throw new AppError("invalid:input", "The refit settings have problems.", fieldErrorsOf(parsed.error));
  return parsed.data;
}

/** What the fit would use (points, weights) — the same checks as starting it, without starting anything. */
export async function previewFit(proposalId: string, input: unknown): Promise<FitPreview> {
  const spec = parseFitSpec(input);
  const ctx = await loadFitContext(db, proposalId, spec.referenceSetId);
  return checkedPreview(ctx, spec);
}

/** Serialises one person's starts, so the limit on active refits holds under concurrent requests. */
async function lockPerson(tx: Tx, userId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`fits:${userId}`}))`);
}

/** Hands a committed run to the queue; if the queue is unreachable the run is marked failed, not left waiting. */
async function handOver(fitId: string): Promise<void> {
  try {
    await enqueueFit(fitId);
  } catch (err) {
    const reason = `could not hand the refit to the job queue: ${err instanceof Error ? err.message : String(err)}`;
    await db.update(fitRuns).set({ status: "failed", failureReason: reason, finishedAt: new Date() }).where(eq(fitRuns.id, fitId));
    throw new AppError("conflict:queue", `The refit was recorded but ${reason}. Try again in a moment.`);
  }
}

/** A fit whose free parameters the selected values cannot pin down is refused before it starts. */
function refuseUndetermined(preview: FitPreview, doc: ModelDocument): void {
  if (!preview.undetermined) return;
  const labels = new Map(listParameters(doc).map((p) => [p.key, p.label]));
  const message = preview.insensitive.length
    ? `No value in the fit changes with ${preview.insensitive.map((k) => labels.get(k) ?? k).join(", ")} (by symmetry, or because the alignment shift takes the change up), so the fit cannot determine ${preview.insensitive.length === 1 ? "it" : "them"}. Fix ${preview.insensitive.length === 1 ? "it" : "them"}.`
    : "Some combination of the free parameters changes no value in the fit, so the fit cannot determine them all. Fix one of the parameters that act together.";
  throw new AppError("refused:fit-input", `This refit cannot start: ${message}`, undefined, { reasons: [message] });
}

/** Records a refit after every check (rules, settings, preview); it waits for a worker until handed over. */
export async function createFitRun(actor: SessionUser, proposalId: string, input: unknown): Promise<{ fitId: string; preview: FitPreview }> {
  const spec = parseFitSpec(input);
  const ctx = await loadFitContext(db, proposalId, spec.referenceSetId);
  enforce(decideStartFit(actor, ctx.facts, 0));
  const preview = await checkedPreview(ctx, spec);
  refuseUndetermined(preview, ctx.document);
  const fitId = await db.transaction(async (tx) => {
    await lockPerson(tx, actor.id);
    enforce(decideStartFit(actor, ctx.facts, await countActiveFits(tx, actor.id)));
    const [row] = await tx
      .insert(fitRuns)
      .values({ proposalId, baseRevisionId: ctx.revision.id, referenceSetId: ctx.reference.id, startedBy: actor.id, spec, engineVersion: TB_ENGINE_VERSION })
      .returning({ id: fitRuns.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "fit.started",
      subjectType: "proposal",
      subjectId: proposalId,
      after: { fit: row.id, revision: ctx.revision.number, reference: ctx.reference.name, parameters: spec.parameters.map((p) => p.key), points: preview.points },
    });
    return row.id;
  });
  return { fitId, preview };
}

export async function startFit(actor: SessionUser, proposalId: string, input: unknown): Promise<{ fitId: string; preview: Pick<FitPreview, "points" | "kPoints" | "parameters"> }> {
  const { fitId, preview } = await createFitRun(actor, proposalId, input);
  await handOver(fitId);
  return { fitId, preview: { points: preview.points, kPoints: preview.kPoints, parameters: preview.parameters } };
}

async function requireFit(fitId: string) {
  const row = await getFitRun(db, fitId);
  if (!row) throw new AppError("not-found:fit", "That refit does not exist.");
  return row;
}

/** Runs a stored record again from the same revision, reference set and settings; the re-run never becomes a revision. */
export async function rerunFit(actor: SessionUser, fitId: string): Promise<{ fitId: string }> {
  const original = await requireFit(fitId);
  const ctx = await loadFitContext(db, original.run.proposalId, original.run.referenceSetId, original.run.baseRevisionId);
  const newId = await db.transaction(async (tx) => {
    await lockPerson(tx, actor.id);
    enforce(decideRerunFit(actor, ctx.facts, await countActiveFits(tx, actor.id)));
    const [row] = await tx
      .insert(fitRuns)
      .values({
        proposalId: original.run.proposalId,
        baseRevisionId: original.run.baseRevisionId,
        referenceSetId: original.run.referenceSetId,
        rerunOf: original.run.id,
        startedBy: actor.id,
        spec: original.run.spec,
        engineVersion: TB_ENGINE_VERSION,
      })
      .returning({ id: fitRuns.id });
    await recordAudit(tx, { actorId: actor.id, action: "fit.rerun", subjectType: "proposal", subjectId: original.run.proposalId, after: { fit: row.id, of: original.run.id } });
    return row.id;
  });
  await handOver(newId);
  return { fitId: newId };
}

export async function cancelFit(actor: SessionUser, fitId: string): Promise<{ status: string }> {
  const status = await db.transaction(async (tx) => {
    const [run] = await tx.select().from(fitRuns).where(eq(fitRuns.id, fitId)).for("update");
    if (!run) throw new AppError("not-found:fit", "That refit does not exist.");
    enforce(decideCancelFit(actor, run));
    const now = new Date();
    // A waiting run is cancelled at once; a running one is stopped by its worker at the next progress write.
    const next = run.status === "queued" ? { status: "cancelled" as const, finishedAt: now, cancelRequestedAt: now } : { cancelRequestedAt: now };
    await tx.update(fitRuns).set(next).where(eq(fitRuns.id, fitId));
    await recordAudit(tx, { actorId: actor.id, action: "fit.cancelled", subjectType: "proposal", subjectId: run.proposalId, after: { fit: fitId, was: run.status } });
    return next.status ?? run.status;
  });
  if (status === "cancelled") {
    try {
      await (await jobQueue()).cancel(QUEUES.fitRun, fitId);
    } catch {
      // the worker checks the run's status before starting, so a job left in the queue does nothing
    }
  }
  return { status };
}

export const applyFitInput = z.object({ version: z.number().int().min(0) });

/** Saves a finished fit's best point as the next revision, on the author's explicit request. */
export async function applyFit(actor: SessionUser, fitId: string, input: unknown): Promise<{ revision: number; version: number }> {
  const parsed = applyFitInput.safeParse(input);
  if (!parsed.success) throw new AppError("invalid:input", "The request body has problems.", fieldErrorsOf(parsed.error));
  const found = await requireFit(fitId);
  const ctx = await loadFitContext(db, found.run.proposalId, found.run.referenceSetId, found.run.baseRevisionId);
  // Saved on top of the latest revision, so its later edits (metadata, other fits' values) are kept — but only when
  // that loses nothing: a revision that changed parameters this fit held fixed would be undone. The document and its
  // facts are computed before the lock; the lock then confirms nothing changed meanwhile.
  const latest = await getLatestRevision(db, found.run.proposalId);
  const latestDoc = latest && latest.id !== found.run.baseRevisionId ? parseDocument(latest.document) : null;
  const outcome = found.run.outcome;
  const keeps = !latest || !latestDoc || (latestDoc.ok && outcome !== null && fitStillApplies(ctx.document, latestDoc.doc, outcome));
  const moved = outcome !== null && outcome.values.some((v, i) => v !== outcome.start[i]);
  const prepared = outcome && moved && keeps ? await prepareFitRevision(ctx, found.run, latestDoc?.ok ? latestDoc.doc : ctx.document, outcome) : null;
  return db.transaction(async (tx) => {
    const [run] = await tx.select().from(fitRuns).where(eq(fitRuns.id, fitId)).for("update");
    const proposal = await lockProposal(tx, run.proposalId);
    if (!proposal) throw new AppError("not-found:proposal", "That proposal does not exist.");
    enforce(decideApplyFit(actor, { ...ctx.facts, stage: proposal.stage }, { status: run.status, hasOutcome: Boolean(run.outcome), resultRevision: Boolean(run.resultRevisionId), rerun: Boolean(run.rerunOf) }));
    if (proposal.version !== parsed.data.version || (await getLatestRevision(tx, proposal.id))?.id !== latest?.id) {
      throw new AppError("conflict:stale", `Someone changed this proposal while you were looking (it is now at version ${proposal.version}). Reload to see its current revisions.`);
    }
    if (!moved) throw new AppError("refused:unchanged", "This fit moved no value from its start, so there is nothing to save as a revision.");
    if (!prepared) {
      throw new AppError(
        "refused:superseded",
        `Revision ${latest?.number} changed parameters this fit kept fixed (it started from revision ${found.baseRevisionNumber}); saving it would undo them. Start a new refit from revision ${latest?.number} instead.`,
      );
    }
    const saved = await appendRevision(tx, actor, proposal, prepared, fitRevisionNote(run.outcome as NonNullable<typeof run.outcome>, found.referenceName, fitId), { fit: fitId });
    await tx.update(fitRuns).set({ resultRevisionId: saved.revisionId, applyNote: null }).where(eq(fitRuns.id, fitId));
    return { revision: saved.revision, version: saved.version };
  });
}
