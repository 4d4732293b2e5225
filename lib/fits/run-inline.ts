import "server-only";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { buildFitProblem } from "./problem";
import { appendCost, outcomeOf, type CostPoint } from "./record";
import { claimFit } from "./attempt";
import { finishFit, loadRunContext } from "./worker-side";

/**
 * Runs a recorded fit in this process, start to finish, through the same claim and finish steps as a worker
 * (no heartbeat: nothing else waits on it). For scripts such as the demo seed; the app always uses the queue.
 */
export async function runFitInline(fitId: string): Promise<void> {
  const run = await claimFit(fitId);
  if (!run) return;
  const ctx = await loadRunContext(run);
  const problem = buildFitProblem(ctx.document, ctx.parsedReference, run.spec);
  let history: CostPoint[] = [];
  const result = await fitDocument(ctx.document, problem.keys, problem.reference, {
    ...problem.options,
    onProgress: (p) => (history = appendCost(history, [p.iteration, p.cost, p.elapsedMs])),
  });
  await finishFit(run, ctx, outcomeOf(result), history);
}
