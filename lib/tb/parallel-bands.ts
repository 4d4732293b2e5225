/**
 * Node-only: eigenvalues over many k-points split across worker threads. The pool is long-lived so worker
 * start-up and the model transfer are paid once; a batch is one message per worker, with the k-points and the
 * energies in SharedArrayBuffers (nothing copied or cloned per batch). Workers take chunks of k-points from a
 * shared counter, so a worker slowed by other load simply takes fewer chunks.
 */
import { availableParallelism } from "node:os";
import type { Worker } from "node:worker_threads";
import type { CompiledModel } from "./model";
import { startModuleWorker } from "./worker-start";
import type { BatchRequest, WorkerReply } from "./parallel-bands-protocol";

export interface BandWorkerPool {
  readonly threads: number;
  /** Sends the model to every worker; later calls to `energies` use it. */
  setModel(model: CompiledModel): Promise<void>;
  /** Eigenvalues, k-major (`size` per k-point), for `dimension` numbers per k-point in kFlat. */
  energies(kFlat: Float64Array): Promise<Float64Array>;
  close(): Promise<void>;
}

/** Chunks per worker in a batch: enough to even out load, few enough that the counter is never contended. */
const CHUNKS_PER_THREAD = 8;

function startWorker(): Worker {
  return startModuleWorker(import.meta.url, "parallel-bands-worker");
}

export function createBandWorkerPool(threads = Math.min(2, availableParallelism())): BandWorkerPool {
  const workers = Array.from({ length: threads }, startWorker);
  let nextId = 0;
  let current: CompiledModel | null = null;
  let failed: Error | null = null;
  // One batch at a time: batches share the buffers below.
  let queue: Promise<unknown> = Promise.resolve();
  const shared = (length: number) => new Float64Array(new SharedArrayBuffer(Math.max(8, length * 8)));
  let kBuffer = shared(0), outBuffer = shared(0);
  const next = new Int32Array(new SharedArrayBuffer(4));
  const batches = new Map<number, { left: number; error: Error | null; resolve: () => void; reject: (e: Error) => void }>();
  const ready: { resolve: () => void; reject: (e: Error) => void }[][] = workers.map(() => []);
  workers.forEach((w, i) => {
    w.on("message", (msg: WorkerReply) => {
      if (msg.type === "ready") return ready[i].shift()?.resolve();
      const batch = batches.get(msg.id);
      if (!batch) return;
      if (msg.type === "error") batch.error ??= new Error(msg.message);
      if (--batch.left > 0) return;
      batches.delete(msg.id);
      if (batch.error) batch.reject(batch.error);
      else batch.resolve();
    });
    w.on("error", (e) => {
      batches.forEach((batch) => batch.reject(e));
      batches.clear();
      ready[i].splice(0).forEach((entry) => entry.reject(e));
      failed = e;
    });
  });

  const run = (model: CompiledModel, kFlat: Float64Array): Promise<Float64Array> => {
    if (failed) return Promise.reject(failed);
    const count = kFlat.length / model.dimension;
    if (count === 0) return Promise.resolve(new Float64Array(0));
    if (kBuffer.length < kFlat.length) kBuffer = shared(kFlat.length);
    if (outBuffer.length < count * model.size) outBuffer = shared(count * model.size);
    kBuffer.set(kFlat);
    Atomics.store(next, 0, 0);
    const id = nextId++;
    const chunk = Math.max(1, Math.ceil(count / (workers.length * CHUNKS_PER_THREAD)));
    const request: BatchRequest = { type: "batch", id, k: kBuffer, out: outBuffer, next, count, chunk };
    return new Promise<void>((resolve, reject) => {
      batches.set(id, { left: workers.length, error: null, resolve, reject });
      for (const w of workers) w.postMessage(request);
    }).then(() => outBuffer.slice(0, count * model.size));
  };

  return {
    threads,
    setModel(model) {
      current = model;
      if (failed) return Promise.reject(failed);
      const sent = queue.then(() => Promise.all(workers.map((w, i) => new Promise<void>((resolve, reject) => {
        ready[i].push({ resolve, reject });
        w.postMessage({ type: "model", model });
      }))));
      queue = sent.catch(() => undefined);
      return sent.then(() => undefined);
    },
    energies(kFlat) {
      const model = current;
      if (!model) return Promise.reject(new Error("setModel first"));
      if (!Number.isInteger(kFlat.length / model.dimension)) {
        return Promise.reject(new Error(`energies: ${kFlat.length} numbers is not a whole number of ${model.dimension}-d k-points`));
      }
      const result = queue.then(() => run(model, kFlat));
      queue = result.catch(() => undefined);
      return result;
    },
    async close() {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}
