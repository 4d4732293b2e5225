import { spawn, type ChildProcess } from "node:child_process";
import { desc, eq, sql } from "drizzle-orm";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { fitRuns, revisions, type FitRun } from "@/db/schema";
import { buildFitProblem } from "@/lib/fits/problem";
import { FINAL_FIT_STATUSES } from "@/lib/fits/record";
import { parseFitSpec } from "@/lib/fits/service";
import { loadRunContext } from "@/lib/fits/worker-side";
import { enqueueFit, stopJobQueue } from "@/lib/jobs/boss";
import { WORKER_APPLICATION_NAME } from "@/lib/jobs/queues";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { TB_ENGINE_VERSION } from "@/lib/tb/version";
import { createFitWorld, DIAMOND_KEYS, DIAMOND_START, diamondDocument, fitRow, proposalToFit, syntheticReference } from "../integration/fit-world";

/*
 * Real worker processes, killed and stopped while they run a refit. A crash (SIGKILL) counts against the retry limit
 * (2 by default), a graceful stop (SIGTERM) does not: after one crash and two stops the refit still finishes. Each
 * attempt resumes from the checkpoint of the last, so the finished record equals a run that was never interrupted.
 * The workers here must be the only ones on the database (scripts/test.sh runs this before its shared worker starts).
 */
const STALL_SECONDS = 10;
const running = new Set<ChildProcess>();

function startWorker(): ChildProcess {
  const worker = spawn(process.execPath, ["--import", "tsx", "--conditions=react-server", "lib/jobs/worker-main.ts"], {
    env: { ...process.env, FIT_CONCURRENCY: "1", FIT_STALL_SECONDS: String(STALL_SECONDS), JOBS_POLL_SECONDS: "0.5" },
    stdio: ["ignore", "ignore", "inherit"],
  });
  running.add(worker);
  worker.on("exit", () => running.delete(worker));
  return worker;
}

function exited(worker: ChildProcess): Promise<number | string | null> {
  if (worker.exitCode !== null || worker.signalCode !== null) return Promise.resolve(worker.exitCode ?? worker.signalCode);
  return new Promise((resolve) => worker.once("exit", (code, signal) => resolve(code ?? signal)));
}

/** Polls the fit record until `ready` holds; a final status that does not satisfy it ends the wait at once. */
async function rowWhen(fitId: string, what: string, ready: (row: FitRun) => boolean, seconds = 150): Promise<FitRun> {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const row = await fitRow(fitId);
    if (ready(row)) return row;
    if (FINAL_FIT_STATUSES.includes(row.status)) throw new Error(`waiting for ${what}, the refit ended ${row.status}: ${row.failureReason ?? row.outcome?.reason}`);
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what} (status ${row.status}, attempt ${row.attempts}, iteration ${row.iteration})`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** A diamond sp3s* refit of about 60 iterations (six starts on 1500 k-points), recorded and queued as startFit does. */
async function queuedRefit(): Promise<string> {
  const points = 1500;
  const diamond = diamondDocument();
  const world = await createFitWorld(diamond);
  const { proposalId, referenceId } = await proposalToFit(world, diamond, DIAMOND_START, syntheticReference(diamond, 0.003, 9, points), points);
  const [latest] = await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.proposalId, proposalId)).orderBy(desc(revisions.number)).limit(1);
  const spec = parseFitSpec({ referenceSetId: referenceId, parameters: DIAMOND_KEYS.map((key) => ({ key })), restarts: 5, seed: 4 });
  const [run] = await db
    .insert(fitRuns)
    .values({ proposalId, baseRevisionId: latest.id, referenceSetId: referenceId, startedBy: world.author.id, spec, engineVersion: TB_ENGINE_VERSION })
    .returning({ id: fitRuns.id });
  await enqueueFit(run.id);
  return run.id;
}

afterEach(async () => {
  for (const worker of running) worker.kill("SIGKILL");
});
afterAll(async () => {
  await stopJobQueue();
  await closeDb();
});

describe("a refit whose workers crash and stop", () => {
  it("survives one crash and two graceful stops, resuming each time where it stood, and ends as if never interrupted", async () => {
    const others = await db.execute<{ n: number }>(
      sql`select count(*)::int as n from pg_stat_activity where datname = current_database() and application_name = ${WORKER_APPLICATION_NAME}`,
    );
    expect(others.rows[0].n, "another worker is connected to this database; stop it first (it would take the refit)").toBe(0);
    const fitId = await queuedRefit();

    // Attempt 1 is killed outright: no hand-back, the heartbeat just stops.
    const first = startWorker();
    await rowWhen(fitId, "attempt 1 to make progress", (r) => r.status === "running" && r.attempts === 1 && r.iteration >= 3);
    first.kill("SIGKILL");
    await exited(first);

    // The next worker's sweep sees the stale heartbeat, counts a crash, and the run resumes from its checkpoint.
    let worker = startWorker();
    let row = await rowWhen(fitId, "attempt 2 to resume after the crash", (r) => r.status === "running" && r.attempts === 2 && r.interruptions.length === 1, 120 + STALL_SECONDS);
    const crash = row.interruptions[0];
    expect([crash.by, row.crashes]).toEqual(["crash", 1]);
    expect(crash.iteration).toBeGreaterThanOrEqual(1);

    // Two graceful stops, each once the resumed attempt has gone further.
    for (const attempt of [2, 3]) {
      const resumedFrom = row.interruptions.at(-1)!;
      row = await rowWhen(fitId, `attempt ${attempt} to go past iteration ${resumedFrom.iteration}`, (r) => r.attempts === attempt && r.iteration >= resumedFrom.iteration + 3);
      // It started where the last attempt stood, never above the lowest cost reached before.
      expect(row.cost).toBeLessThanOrEqual(resumedFrom.cost as number);
      worker.kill("SIGTERM");
      expect(await exited(worker)).toBe(0);
      row = await fitRow(fitId);
      expect([row.status, row.crashes, row.interruptions.length], row.failureReason ?? "").toEqual(["queued", 1, attempt]);
      const stop = row.interruptions.at(-1)!;
      expect(stop.by).toBe("stop");
      expect(stop.iteration).toBe(row.iteration);
      expect(stop.iteration).toBeGreaterThan(resumedFrom.iteration);
      expect(row.checkpoint?.iteration).toBe(stop.iteration);
      worker = startWorker();
    }

    const done = await rowWhen(fitId, "the refit to finish", (r) => FINAL_FIT_STATUSES.includes(r.status), 180);
    expect(["converged", "not_converged"], done.failureReason ?? "").toContain(done.status);
    expect([done.attempts, done.crashes, done.interruptions.map((i) => i.by)]).toEqual([4, 1, ["crash", "stop", "stop"]]);

    // The same fit in this process, without interruption: the record must match it value for value, step for step.
    const ctx = await loadRunContext(done);
    const problem = buildFitProblem(ctx.document, ctx.parsedReference, done.spec);
    const steps: [number, number][] = [];
    const whole = await fitDocument(ctx.document, problem.keys, problem.reference, { ...problem.options, onProgress: (p) => steps.push([p.iteration, p.cost]) });
    expect(done.outcome?.values).toEqual(whole.values);
    expect(done.outcome?.cost).toBe(whole.cost);
    expect(done.costHistory.map(([iteration, cost]) => [iteration, cost])).toEqual(steps);
  });
});
