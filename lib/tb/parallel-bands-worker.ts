import { parentPort } from "node:worker_threads";
import { computeEnergiesFlat } from "./bands";
import type { CompiledModel } from "./model";
import type { BatchRequest, WorkerReply } from "./parallel-bands-protocol";

/**
 * Worker side of parallel-bands.ts: keeps one compiled model; for a batch it takes chunks of k-points from the
 * shared counter until none are left, writing energies straight into the shared output.
 */
let model: CompiledModel | null = null;

const reply = (msg: WorkerReply) => parentPort?.postMessage(msg);

parentPort?.on("message", (msg: { type: "model"; model: CompiledModel } | BatchRequest) => {
  if (msg.type === "model") {
    model = msg.model;
    reply({ type: "ready" });
    return;
  }
  try {
    if (!model) throw new Error("no model set");
    const { k, out, next, count, chunk } = msg;
    for (let first = Atomics.add(next, 0, chunk); first < count; first = Atomics.add(next, 0, chunk)) {
      computeEnergiesFlat(model, k, out, first, Math.min(count, first + chunk));
    }
    reply({ type: "done", id: msg.id });
  } catch (e) {
    reply({ type: "error", id: msg.id, message: e instanceof Error ? e.message : String(e) });
  }
});
