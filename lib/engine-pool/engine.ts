import "server-only";
import { availableParallelism } from "node:os";
import { Worker, type WorkerOptions } from "node:worker_threads";
import { serverEnv } from "@/lib/env";
import { startModuleWorker } from "@/lib/tb/worker-start";
import type { EngineTaskName, EngineTasks } from "./tasks";
import { ThreadPool } from "./thread-pool";

/** Heap of one engine thread: far above what a model within the basis limit needs, far below the machine's memory. */
const THREAD_OPTIONS: WorkerOptions = { name: "bandgate-engine", resourceLimits: { maxOldGenerationSizeMb: 512 } };

function startEngineThread(): Worker {
  // The built app (Next.js with Turbopack) compiles a thread entry from exactly this expression; tsx and vitest run
  // the TypeScript source, which startModuleWorker loads through tsx inside the thread.
  if (process.env.NEXT_RUNTIME === "nodejs") return new Worker(new URL("./engine-thread.ts", import.meta.url), THREAD_OPTIONS);
  return startModuleWorker(import.meta.url, "engine-thread", THREAD_OPTIONS);
}

function createEnginePool(): ThreadPool {
  const env = serverEnv();
  return new ThreadPool({
    threads: env.ENGINE_THREADS ?? Math.min(4, Math.max(2, availableParallelism() - 1)),
    queueLimit: env.ENGINE_QUEUE_LIMIT,
    timeoutMs: env.ENGINE_TASK_TIMEOUT_SECONDS * 1000,
    start: startEngineThread,
  });
}

// One pool per process; on globalThis so that reloaded modules (next dev) share it.
const holder = globalThis as typeof globalThis & { bandgateEnginePool?: ThreadPool };

export function enginePool(): ThreadPool {
  return (holder.bandgateEnginePool ??= createEnginePool());
}

/**
 * Runs an engine computation on a pool thread, never on the caller's: the web process keeps answering while it
 * runs. Refused with `unavailable:engine-busy` when the queue is full, `unavailable:engine-timeout` when it overruns.
 */
export function runEngine<N extends EngineTaskName>(task: N, ...args: Parameters<EngineTasks[N]>): Promise<ReturnType<EngineTasks[N]>> {
  return enginePool().run(task, args) as Promise<ReturnType<EngineTasks[N]>>;
}

export async function closeEnginePool(): Promise<void> {
  const pool = holder.bandgateEnginePool;
  holder.bandgateEnginePool = undefined;
  await pool?.close();
}
