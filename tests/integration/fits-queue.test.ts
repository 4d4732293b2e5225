import { desc, eq } from "drizzle-orm";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { fitRuns, revisions, users } from "@/db/schema";
import { FINAL_FIT_STATUSES, outcomeOf, type FitOutcome } from "@/lib/fits/record";
import { parseFitSpec } from "@/lib/fits/service";
import { buildFitProblem } from "@/lib/fits/problem";
import { claimFit } from "@/lib/fits/attempt";
import { finishFit, loadRunContext } from "@/lib/fits/worker-side";
import { fitJobLimits, QUEUES, type FitRunJob } from "@/lib/jobs/queues";
import { jobSettings } from "@/lib/jobs/settings";
import { giveBackStalledFits } from "@/lib/jobs/stalled-fits";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { getParameter } from "@/lib/tb/parameters";
import { TB_ENGINE_VERSION } from "@/lib/tb/version";
import { chainDocument, versionOf } from "../support/board-fixtures";
import { mailTo } from "../support/mailbox";
import { waitFor } from "./registry-world";
import {
  CHAIN_KEYS,
  CHAIN_START,
  createFitWorld,
  DIAMOND_KEYS,
  DIAMOND_START,
  diamondDocument,
  finishedFit,
  fitRow,
  proposalToFit,
  signedIn,
  startFitOverHttp,
  syntheticReference,
} from "./fit-world";

afterAll(closeDb);

/** A chain proposal with a fit run recorded the way startFit records one (queued, no job yet), or with `extra` set. */
async function chainRunRow(extra: Partial<typeof fitRuns.$inferInsert> = {}, settings: Record<string, unknown> = {}) {
  const truth = chainDocument();
  const world = await createFitWorld(truth);
  const { proposalId, referenceId } = await proposalToFit(world, truth, CHAIN_START, syntheticReference(truth, 0.002, 21));
  const [latest] = await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.proposalId, proposalId)).orderBy(desc(revisions.number)).limit(1);
  const spec = parseFitSpec({ referenceSetId: referenceId, parameters: CHAIN_KEYS.map((key) => ({ key })), ...settings });
  const [run] = await db
    .insert(fitRuns)
    .values({ proposalId, baseRevisionId: latest.id, referenceSetId: referenceId, startedBy: world.author.id, spec, engineVersion: TB_ENGINE_VERSION, ...extra })
    .returning();
  return { world, proposalId, run };
}

describe("a refit of the sp3s* model through the job queue", () => {
  it("writes progress well within the stall limit while it runs, converges, and lowers the cost at every accepted step", async () => {
    /*
     * 2500 k-points on the fcc path and one restart: about 3.5 s per start in the worker (measured), so the run lasts
     * several seconds. It converges (not merely stops): the reference is the model's own bands plus 3 meV noise and the
     * start is 0.1–0.3 eV off, which took about 11 iterations per start when measured, far below the 200 allowed.
     */
    const points = 2500;
    const diamond = diamondDocument();
    const world = await createFitWorld(diamond);
    const { proposalId, referenceId } = await proposalToFit(world, diamond, DIAMOND_START, syntheticReference(diamond, 0.003, 9, points), points);
    const author = await signedIn(world.author);
    const fitId = await startFitOverHttp(author, proposalId, { referenceSetId: referenceId, parameters: DIAMOND_KEYS.map((key) => ({ key })), restarts: 1, seed: 4 });

    const beats: number[] = [];
    const iterations = new Set<number>();
    let row = await fitRow(fitId);
    // A generous ceiling: alone the run takes a few seconds, on a machine busy with other work many times that.
    const deadline = Date.now() + 150_000;
    while (!FINAL_FIT_STATUSES.includes(row.status) && Date.now() < deadline) {
      const at = row.progressAt?.getTime();
      if (row.status === "running" && at !== undefined && at !== beats.at(-1)) beats.push(at);
      if (row.status === "running") iterations.add(row.iteration);
      await new Promise((r) => setTimeout(r, 100));
      row = await fitRow(fitId);
    }
    expect(row.status, row.failureReason ?? "").toBe("converged");
    expect(beats.length).toBeGreaterThanOrEqual(3);
    const gaps = beats.slice(1).map((t, i) => t - beats[i]);
    // A live fit must never look stalled: its heartbeat (every FIT_PROGRESS_MS) stays far inside the stall limit.
    expect(Math.max(...gaps), `gaps between progress writes: ${gaps.join(", ")} ms`).toBeLessThan((jobSettings().FIT_STALL_SECONDS * 1000) / 4);
    expect(iterations.size, "distinct iterations seen while running").toBeGreaterThanOrEqual(3);

    // Each start is its own Levenberg–Marquardt descent: a step is accepted only when it lowers the cost (Marquardt,
    // J. SIAM 11, 431 (1963)), so the history falls within each start and may jump up where the next start begins.
    const outcome = row.outcome as FitOutcome;
    expect(outcome.starts).toHaveLength(2);
    let offset = 0;
    let covered = 0;
    for (const start of outcome.starts) {
      const costs = row.costHistory.filter(([it]) => it > offset && it <= offset + start.iterations).map(([, cost]) => cost);
      expect(costs.length).toBeGreaterThan(0);
      costs.slice(1).forEach((cost, i) => expect(cost).toBeLessThan(costs[i]));
      expect(costs.at(-1)).toBe(start.cost);
      offset += start.iterations;
      covered += costs.length;
    }
    expect(covered).toBe(row.costHistory.length);
    expect(outcome.cost).toBe(Math.min(...outcome.starts.map((s) => s.cost)));
    // Recovery within 3 standard errors, as for the chain (Press et al., Numerical Recipes, 2nd ed. (1992), §15.6).
    const se = outcome.standardErrors as number[];
    DIAMOND_KEYS.forEach((key, i) => expect(Math.abs(outcome.values[i] - getParameter(diamond, key)), key).toBeLessThan(3 * se[i]));
  }, 180_000);
});

describe("a worker that dies holding a refit", () => {
  let boss: PgBoss;

  beforeAll(async () => {
    boss = new PgBoss({ connectionString: process.env.DATABASE_URL, migrate: false, max: 2, supervise: false, schedule: false });
    await boss.start();
  });
  afterAll(() => boss.stop({ graceful: false, wait: true }));

  const { FIT_RETRY_LIMIT } = jobSettings();
  const STALL_MS = 60_000;

  /**
   * A run and its job as startFit makes them, taken and claimed by a worker that then dies, after `crashes` earlier
   * crashes. The job is sent with a start time an hour away, so the real worker (which only fetches jobs due now)
   * cannot take it first; this test fetches it with the same query a worker uses, ignoring that start time, and
   * claims the run as runFitJob would. Its last heartbeat is then made two minutes old, past the stall limit.
   */
  async function runHeldByDeadWorker(crashes: number): Promise<string> {
    const { run } = await chainRunRow({ crashes });
    const startAfter = new Date(Date.now() + 3600_000);
    await boss.send(QUEUES.fitRun, { fitId: run.id } satisfies FitRunJob, { ...fitJobLimits(), id: run.id, retryDelay: 1, priority: 1000, startAfter });
    const [job] = await boss.fetch<FitRunJob>(QUEUES.fitRun, { ignoreStartAfter: true });
    expect(job?.id, "the test's own job comes first (highest priority)").toBe(run.id);
    expect((await claimFit(run.id, FIT_RETRY_LIMIT))?.attempts).toBe(1);
    await db.update(fitRuns).set({ progressAt: new Date(Date.now() - 2 * STALL_MS) }).where(eq(fitRuns.id, run.id));
    // The running worker's own sweep may get there first; either way the run is given back once.
    await giveBackStalledFits(boss, STALL_MS, FIT_RETRY_LIMIT);
    return run.id;
  }

  it("counts a crash, gives the job back to the queue, and a live worker finishes it on the second attempt", async () => {
    const fitId = await runHeldByDeadWorker(0);
    const back = await fitRow(fitId);
    expect([back.status, back.crashes]).toEqual(["queued", 1]);
    expect(back.failureReason).toMatch(/^attempt 1: the worker stopped responding \(no progress since \d\d:\d\d:\d\d UTC\)$/);
    expect(back.interruptions).toEqual([{ at: expect.any(String), by: "crash", iteration: 0, cost: null }]);
    expect((await boss.getJobById(QUEUES.fitRun, fitId))?.state).toBe("retry");
    const row = await finishedFit(fitId);
    expect(row.status, row.failureReason ?? "").toBe("converged");
    expect([row.attempts, row.crashes]).toEqual([2, 1]);
    expect(row.outcome?.values.length).toBe(CHAIN_KEYS.length);
  });

  it("with no retries left, marks the run failed with a reason and cancels its job", async () => {
    const fitId = await runHeldByDeadWorker(FIT_RETRY_LIMIT);
    const row = await fitRow(fitId);
    expect([row.status, row.attempts, row.crashes]).toEqual(["failed", 1, FIT_RETRY_LIMIT + 1]);
    expect(row.failureReason).toMatch(new RegExp(`^crashed ${FIT_RETRY_LIMIT + 1} times, more than the ${FIT_RETRY_LIMIT} allowed; no retries left \\(last: attempt 1: the worker stopped responding`));
    expect(row.outcome).toBeNull();
    expect((await boss.getJobById(QUEUES.fitRun, fitId))?.state).toBe("cancelled");
    // Whoever started it hears about a failure by e-mail, with the reason and a link to the record.
    const [starter] = await db.select({ email: users.email }).from(users).where(eq(users.id, row.startedBy));
    const [mail] = await waitFor("the failure notice", async () => {
      const box = (await mailTo(starter.email)).filter((m) => m.subject.startsWith("Refit failed"));
      return box.length ? box : null;
    });
    expect(mail.textBody).toContain("no retries left");
    expect(mail.textBody).toContain(`/fits/${fitId}`);
  });
});

describe("a re-run that stops short", () => {
  it("is not offered for saving by hand, in its note as in the apply rule", async () => {
    const { world, proposalId, run: original } = await chainRunRow({ status: "not_converged" }, { maxIterations: 1 });
    const [rerun] = await db.insert(fitRuns).values({ ...original, id: undefined, rerunOf: original.id, status: "running", createdAt: undefined }).returning();
    const ctx = await loadRunContext(rerun);
    const problem = buildFitProblem(ctx.document, ctx.parsedReference, rerun.spec);
    const outcome = outcomeOf(await fitDocument(ctx.document, problem.keys, problem.reference, problem.options));
    expect(outcome.status).toBe("not converged");
    await finishFit(rerun, ctx, outcome, []);
    const row = await fitRow(rerun.id);
    expect([row.status, row.resultRevisionId]).toEqual(["not_converged", null]);
    expect(row.applyNote).toBe("A re-run checks that the stored fit reproduces; it is not saved as a revision.");
    const author = await signedIn(world.author);
    const res = await author.json(`/api/fits/${rerun.id}/apply`, "POST", { version: await versionOf(proposalId) });
    expect([res.status, ((await res.json()) as { error: { code: string } }).error.code]).toEqual([422, "refused:rerun"]);
  });
});
