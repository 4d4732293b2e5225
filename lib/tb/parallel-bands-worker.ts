import { parentPort } from "node:worker_threads";
import { computeEnergiesFlat } from "./bands";
import type { CompiledModel } from "./model";

/** Worker side of parallel-bands.ts: keeps one compiled model, answers energy requests for k-point chunks. */
let model: CompiledModel | null = null;

parentPort?.on("message", (msg: { type: "model"; model: CompiledModel } | { type: "energies"; id: number; k: Float64Array }) => {
  if (msg.type === "model") {
    model = msg.model;
    parentPort?.postMessage({ type: "ready" });
    return;
  }
  try {
    if (!model) throw new Error("no model set");
    const out = new Float64Array((msg.k.length / model.dimension) * model.size);
    computeEnergiesFlat(model, msg.k, out);
    parentPort?.postMessage({ type: "energies", id: msg.id, out }, [out.buffer as ArrayBuffer]);
  } catch (e) {
    parentPort?.postMessage({ type: "error", id: msg.id, message: e instanceof Error ? e.message : String(e) });
  }
});
