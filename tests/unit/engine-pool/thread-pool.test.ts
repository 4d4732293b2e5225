import { Worker } from "node:worker_threads";
import { afterEach, describe, expect, it } from "vitest";
import type { EngineRequest } from "@/lib/engine-pool/protocol";
import { EngineTaskError, ENGINE_BUSY, ENGINE_TIMEOUT, ThreadPool } from "@/lib/engine-pool/thread-pool";
import { AppError } from "@/lib/errors";

/** A stand-in thread speaking the pool's protocol: echo, fail, spin for ever, or die. */
const STAND_IN = `
const { parentPort, threadId } = require("node:worker_threads");
parentPort.on("message", ({ id, task, args }) => {
  if (task === "echo") return parentPort.postMessage({ id, ok: true, value: { args, threadId } });
  if (task === "fail") return parentPort.postMessage({ id, ok: false, name: "RangeError", message: "no such band" });
  if (task === "die") process.exit(3);
  if (task === "forever") for (;;) {}
});`;

const pools: ThreadPool[] = [];
function pool(options: { threads?: number; queueLimit?: number; timeoutMs?: number } = {}): ThreadPool {
  const p = new ThreadPool({ threads: options.threads ?? 1, queueLimit: options.queueLimit ?? 8, timeoutMs: options.timeoutMs ?? 60_000, start: () => new Worker(STAND_IN, { eval: true }) });
  pools.push(p);
  return p;
}
const run = (p: ThreadPool, task: string, ...args: unknown[]) => p.run(task as EngineRequest["task"], args);
const codeOf = (err: unknown) => (err instanceof AppError ? err.code : String(err));
/** Long enough for a thread to start on a machine whose cores are busy with other work. */
const OVERRUN_MS = 3000;

afterEach(async () => {
  await Promise.all(pools.splice(0).map((p) => p.close()));
});

describe("engine thread pool", { timeout: 30_000 }, () => {
  it("answers each task on a thread, in order, and reports a task's own error by name and message", async () => {
    const p = pool({ threads: 2 });
    const answers = await Promise.all([run(p, "echo", 1), run(p, "echo", 2), run(p, "echo", 3)]);
    expect(answers.map((a) => (a as { args: number[] }).args[0])).toEqual([1, 2, 3]);
    const failure = await run(p, "fail").catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(EngineTaskError);
    expect(failure).toMatchObject({ name: "RangeError", message: "no such band" });
    expect(p.stats).toEqual({ threads: 2, busy: 0, queued: 0 });
  });

  it("refuses at once with engine-busy when every thread is taken and the queue is full", async () => {
    const p = pool({ threads: 1, queueLimit: 1, timeoutMs: 60_000 });
    const running = run(p, "forever").catch(codeOf);
    const waiting = run(p, "echo", "queued").catch(codeOf);
    await expect(run(p, "echo", "one too many")).rejects.toMatchObject({ code: ENGINE_BUSY });
    expect(p.stats).toMatchObject({ busy: 1, queued: 1 });
    await p.close();
    expect(await running).toMatch(/closed/);
    expect(await waiting).toMatch(/closed/);
  });

  it("stops a task that overruns with engine-timeout, replaces its thread, and runs what waited", async () => {
    const p = pool({ threads: 1, timeoutMs: OVERRUN_MS });
    const first = (await run(p, "echo")) as { threadId: number };
    const stuck = run(p, "forever");
    const next = run(p, "echo", "after");
    await expect(stuck).rejects.toMatchObject({ code: ENGINE_TIMEOUT });
    const after = (await next) as { args: string[]; threadId: number };
    expect(after.args).toEqual(["after"]);
    expect(after.threadId).not.toBe(first.threadId);
  });

  it("fails the task of a thread that dies and carries on with a new thread", async () => {
    const p = pool({ threads: 1 });
    await expect(run(p, "die")).rejects.toThrow(/exit code 3/);
    expect(((await run(p, "echo", "alive")) as { args: string[] }).args).toEqual(["alive"]);
    expect(p.stats.threads).toBe(1);
  });

  it("refuses a task that waits longer than the timeout for a thread", async () => {
    const p = pool({ threads: 1, timeoutMs: OVERRUN_MS });
    await run(p, "echo"); // the thread is up: what follows is timed from a running thread
    const stuck = run(p, "forever").catch(codeOf);
    const nextStuck = run(p, "forever").catch(codeOf); // takes the thread when the first is stopped
    await expect(run(p, "echo")).rejects.toMatchObject({ code: ENGINE_BUSY });
    expect([await stuck, await nextStuck]).toEqual([ENGINE_TIMEOUT, ENGINE_TIMEOUT]);
  });
});
