import type { Worker } from "node:worker_threads";
import { AppError } from "@/lib/errors";
import type { EngineReply, EngineRequest } from "./protocol";

export interface ThreadPoolOptions {
  /** Threads at most; each is started when first needed and replaced when it dies or overruns. */
  threads: number;
  /** Tasks that may wait for a free thread; one more is refused at once. */
  queueLimit: number;
  /** A task that waits or runs longer is refused; a running one has its thread terminated. */
  timeoutMs: number;
  start: () => Worker;
}

interface Job {
  id: number;
  request: EngineRequest;
  resolve: (value: unknown) => void;
  reject: (err: Error) => void;
  timer: NodeJS.Timeout | null;
}

interface Slot {
  worker: Worker;
  job: Job | null;
}

export const ENGINE_BUSY = "unavailable:engine-busy";
export const ENGINE_TIMEOUT = "unavailable:engine-timeout";

/** An error a task threw inside its thread (its class does not survive the trip; name and message do). */
export class EngineTaskError extends Error {
  constructor(name: string, message: string) {
    super(message);
    this.name = name;
  }
}

/**
 * A fixed set of worker threads with a bounded queue: the web process hands computations over and stays free to
 * answer other requests. Idle threads do not keep the process alive.
 */
export class ThreadPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(private readonly options: ThreadPoolOptions) {}

  get stats(): { threads: number; busy: number; queued: number } {
    return { threads: this.slots.length, busy: this.slots.filter((s) => s.job).length, queued: this.queue.length };
  }

  run(task: EngineRequest["task"], args: unknown[]): Promise<unknown> {
    if (this.closed) return Promise.reject(new Error("the engine pool is closed"));
    return new Promise((resolve, reject) => {
      const id = this.nextId++;
      const job: Job = { id, request: { id, task, args }, resolve, reject, timer: null };
      const slot = this.freeSlot();
      if (slot) return this.dispatch(slot, job);
      if (this.queue.length >= this.options.queueLimit) return reject(busy());
      job.timer = setTimeout(() => {
        this.queue.splice(this.queue.indexOf(job), 1);
        reject(busy());
      }, this.options.timeoutMs);
      this.queue.push(job);
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) {
      clearTimeout(job.timer ?? undefined);
      job.reject(new Error("the engine pool was closed"));
    }
    await Promise.all(this.slots.splice(0).map((slot) => this.retire(slot, new Error("the engine pool was closed"))));
  }

  private freeSlot(): Slot | null {
    const idle = this.slots.find((s) => !s.job);
    if (idle) return idle;
    if (this.slots.length >= this.options.threads) return null;
    const slot: Slot = { worker: this.startWorker(), job: null };
    this.slots.push(slot);
    this.watch(slot);
    return slot;
  }

  private startWorker(): Worker {
    const worker = this.options.start();
    worker.unref();
    return worker;
  }

  private watch(slot: Slot): void {
    const worker = slot.worker;
    worker.on("message", (reply: EngineReply) => {
      const job = slot.job;
      if (slot.worker !== worker || !job || job.id !== reply.id) return;
      this.finish(slot);
      if (reply.ok) job.resolve(reply.value);
      else job.reject(new EngineTaskError(reply.name, reply.message));
      this.pump();
    });
    worker.on("error", (err) => this.replace(slot, worker, new Error(`an engine thread failed: ${err.message}`)));
    worker.on("exit", (code) => this.replace(slot, worker, new Error(`an engine thread stopped (exit code ${code})`)));
  }

  private dispatch(slot: Slot, job: Job): void {
    clearTimeout(job.timer ?? undefined);
    slot.job = job;
    job.timer = setTimeout(() => {
      const seconds = Math.round(this.options.timeoutMs / 1000);
      this.replace(slot, slot.worker, new AppError(ENGINE_TIMEOUT, `The computation took longer than ${seconds} s and was stopped. Try again later, or with a smaller model.`));
    }, this.options.timeoutMs);
    slot.worker.ref();
    slot.worker.postMessage(job.request);
  }

  private finish(slot: Slot): void {
    clearTimeout(slot.job?.timer ?? undefined);
    slot.job = null;
    slot.worker.unref();
  }

  /** Ends a thread that died or overran: its task fails with `reason`, and a fresh thread takes its place. */
  private replace(slot: Slot, worker: Worker, reason: Error): void {
    if (slot.worker !== worker || this.closed) return;
    void this.retire(slot, reason);
    slot.worker = this.startWorker();
    this.watch(slot);
    this.pump();
  }

  private async retire(slot: Slot, reason: Error): Promise<void> {
    const job = slot.job;
    const worker = slot.worker;
    this.finish(slot);
    job?.reject(reason);
    worker.removeAllListeners("message");
    await worker.terminate();
  }

  private pump(): void {
    while (this.queue.length) {
      const slot = this.freeSlot();
      if (!slot) return;
      this.dispatch(slot, this.queue.shift()!);
    }
  }
}

function busy(): AppError {
  return new AppError(ENGINE_BUSY, "The server is busy computing other models. Try again in a minute.");
}
