/**
 * Node-only: eigenvalues over many k-points split across worker threads (one chunk per worker).
 * The pool is long-lived so the worker start-up cost is paid once, not per request.
 */
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import type { CompiledModel } from "./model";

type Reply = { type: "ready" } | { type: "energies"; id: number; out: Float64Array } | { type: "error"; id: number; message: string };

export interface BandWorkerPool {
  readonly threads: number;
  /** Sends the model to every worker; later calls to `energies` use it. */
  setModel(model: CompiledModel): Promise<void>;
  /** Eigenvalues, k-major (`size` per k-point), for `dimension` numbers per k-point in kFlat. */
  energies(kFlat: Float64Array): Promise<Float64Array>;
  close(): Promise<void>;
}

/**
 * Compiled JavaScript runs the worker file directly; when this module runs as TypeScript source (tsx), the
 * worker thread does not inherit the TypeScript loader, so it registers it before importing the worker.
 */
function startWorker(): Worker {
  const here = import.meta.url;
  if (!here.endsWith(".ts")) return new Worker(new URL("./parallel-bands-worker.js", here));
  const target = new URL("./parallel-bands-worker.ts", here).href;
  let api = "tsx/esm/api";
  try {
    api = import.meta.resolve(api);
  } catch {
    // keep the bare specifier: it resolves from the working directory
  }
  const code = `import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(target)}); })`;
  return new Worker(code, { eval: true });
}

export function createBandWorkerPool(threads = Math.min(2, availableParallelism())): BandWorkerPool {
  const workers = Array.from({ length: threads }, startWorker);
  let nextId = 0;
  let current: CompiledModel | null = null;
  let failed: Error | null = null;
  const waiting = new Map<number, { resolve: (out: Float64Array) => void; reject: (e: Error) => void }>();
  const ready: { resolve: () => void; reject: (e: Error) => void }[][] = workers.map(() => []);
  workers.forEach((w, i) => {
    w.on("message", (msg: Reply) => {
      if (msg.type === "ready") return ready[i].shift()?.resolve();
      const entry = waiting.get(msg.id);
      waiting.delete(msg.id);
      if (msg.type === "error") entry?.reject(new Error(msg.message));
      else entry?.resolve(msg.out);
    });
    w.on("error", (e) => {
      waiting.forEach((entry) => entry.reject(e));
      waiting.clear();
      ready[i].splice(0).forEach((entry) => entry.reject(e));
      failed = e;
    });
  });

  const ask = (w: Worker, k: Float64Array) =>
    new Promise<Float64Array>((resolve, reject) => {
      const id = nextId++;
      waiting.set(id, { resolve, reject });
      w.postMessage({ type: "energies", id, k }, [k.buffer as ArrayBuffer]);
    });

  return {
    threads,
    setModel(model) {
      current = model;
      if (failed) return Promise.reject(failed);
      return Promise.all(workers.map((w, i) => new Promise<void>((resolve, reject) => {
        ready[i].push({ resolve, reject });
        w.postMessage({ type: "model", model });
      }))).then(() => undefined);
    },
    async energies(kFlat) {
      if (failed) throw failed;
      if (!current) throw new Error("setModel first");
      const d = current.dimension, n = current.size;
      const count = kFlat.length / d;
      const per = Math.ceil(count / workers.length);
      const parts = await Promise.all(workers.map((w, i) => ask(w, kFlat.slice(i * per * d, Math.min(count, (i + 1) * per) * d))));
      const out = new Float64Array(count * n);
      let offset = 0;
      for (const p of parts) {
        out.set(p, offset);
        offset += p.length;
      }
      return out;
    },
    async close() {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}
