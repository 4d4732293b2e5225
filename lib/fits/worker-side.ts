import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { fitRuns, type FitRun } from "@/db/schema";
import { decideRevise } from "@/board/rules";
import { getLatestRevision, getUserRoles, lockProposal } from "@/board/queries";
import { parseDocument } from "@/board/revision-facts";
import type { PreparedRevision } from "@/board/revision-intake";
import { appendRevision } from "@/board/service";
import { recordAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { loadFitContext, type FitContext } from "./context";
import { fitStillApplies } from "./apply-onto";
import { notifyFitFinished } from "./notify-finished";
import { prepareFitRevision } from "./fit-revision";
import { fitRevisionNote, statusOfOutcome, undeterminedNames, type CostPoint, type FitOutcome } from "./record";

/* The worker's side of a fit run, its end: the outcome stored (and saved as a revision when it may be), or failure.
   No permission checks here: the run was authorised when it was started. Claims and heartbeats: attempt.ts. */

export function loadRunContext(run: FitRun): Promise<FitContext> {
  return loadFitContext(db, run.proposalId, run.referenceSetId, run.baseRevisionId);
}

const NOT_SAVED: Record<FitOutcome["status"], string> = {
  converged: "",
  "not converged": "The fit did not converge, so its best point was not saved as a revision. Save it by hand if it is good enough.",
  cancelled: "The fit was cancelled; its best point so far can be saved as a revision by hand.",
};

/**
 * Stores the outcome and, for a converged fit that is not a re-run, saves it as the next revision — but only when
 * nobody saved another revision meanwhile and the author may still revise. Otherwise the note says why not, and the
 * author may save it by hand (nothing is overwritten silently).
 */
export async function finishFit(run: FitRun, ctx: FitContext, outcome: FitOutcome, history: CostPoint[]): Promise<void> {
  // The revision it would become is computed before the locks (on an engine thread); used only if still applicable.
  const saveable = !run.rerunOf && outcome.status === "converged" && outcome.values.some((v, i) => v !== outcome.start[i]) && undeterminedNames(outcome).length === 0;
  let prepared: PreparedRevision | null = null;
  let notPrepared: string | null = null;
  if (saveable) {
    try {
      prepared = await prepareFitRevision(ctx, run, ctx.document, outcome);
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      notPrepared = `Not saved as a revision: ${err.message}`;
    }
  }
  await db.transaction(async (tx) => {
    const [current] = await tx.select().from(fitRuns).where(eq(fitRuns.id, run.id)).for("update");
    if (!current || current.status !== "running" || current.attempts !== run.attempts) return;
    let applyNote: string | null = NOT_SAVED[outcome.status] || null;
    let resultRevisionId: string | null = null;
    const unpinned = undeterminedNames(outcome);
    if (run.rerunOf) applyNote = "A re-run checks that the stored fit reproduces; it is not saved as a revision.";
    else if (outcome.status === "converged" && outcome.values.every((v, i) => v === outcome.start[i])) {
      applyNote = "The fit moved no value from its start (it was already at the best point), so there is nothing to save.";
    } else if (outcome.status === "converged" && unpinned.length > 0) {
      applyNote = `Not saved automatically: the reference does not determine ${unpinned.join(", ")} (no usable uncertainty). Fix ${unpinned.length === 1 ? "it" : "them"} and fit again, or save by hand if you accept that.`;
    } else if (outcome.status === "converged") {
      const proposal = await lockProposal(tx, run.proposalId);
      const latest = await getLatestRevision(tx, run.proposalId);
      const starter = await getUserRoles(tx, run.startedBy);
      if (!proposal || !starter) applyNote = "The proposal or its author no longer exists.";
      else if (!starter.active) applyNote = "Not saved as a revision: the account that started this fit has been deactivated.";
      else if (latest?.id !== run.baseRevisionId) {
        const later = latest ? parseDocument(latest.document) : null;
        const keeps = later?.ok === true && fitStillApplies(ctx.document, later.doc, outcome);
        applyNote = `Revision ${latest?.number} was saved while this fit ran (it started from revision ${ctx.revision.number}), so the result was not saved over it. ${
          keeps
            ? `Save it by hand to make it the next revision (revision ${latest?.number}'s other changes are kept).`
            : `Revision ${latest?.number} also changed parameters this fit kept fixed: start a new refit from it.`
        }`;
      } else {
        const decision = decideRevise(starter, proposal);
        if (!decision.allowed) applyNote = `Not saved as a revision: ${decision.reasons.join(" ")}`;
        else if (prepared) {
          try {
            const saved = await tx.transaction((sp) => appendRevision(sp, starter, proposal, prepared, fitRevisionNote(outcome, ctx.reference.name, run.id), { fit: run.id }));
            resultRevisionId = saved.revisionId;
          } catch (err) {
            if (!(err instanceof AppError)) throw err;
            applyNote = `Not saved as a revision: ${err.message}`;
          }
        } else applyNote = notPrepared;
      }
    }
    await tx
      .update(fitRuns)
      .set({
        status: statusOfOutcome(outcome),
        outcome,
        costHistory: history,
        iteration: outcome.iterations,
        cost: outcome.cost,
        elapsedMs: Math.round(outcome.elapsedMs),
        progressAt: new Date(),
        finishedAt: new Date(),
        resultRevisionId,
        applyNote,
        checkpoint: null,
      })
      .where(eq(fitRuns.id, run.id));
    await recordAudit(tx, {
      actorId: null,
      action: "fit.finished",
      subjectType: "proposal",
      subjectId: run.proposalId,
      after: { fit: run.id, status: outcome.status, rms: outcome.rms, iterations: outcome.iterations, savedAsRevision: Boolean(resultRevisionId) },
    });
  });
  await notifyFitFinished(run.id);
}

export async function failFit(fitId: string, reason: string): Promise<void> {
  await db.transaction(async (tx) => {
    const [run] = await tx
      .update(fitRuns)
      .set({ status: "failed", failureReason: reason, finishedAt: new Date() })
      .where(and(eq(fitRuns.id, fitId), inArray(fitRuns.status, ["queued", "running"])))
      .returning({ proposalId: fitRuns.proposalId });
    if (run) await recordAudit(tx, { actorId: null, action: "fit.failed", subjectType: "proposal", subjectId: run.proposalId, after: { fit: fitId, reason } });
  });
  await notifyFitFinished(fitId);
}
