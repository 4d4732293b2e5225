import { parentPort } from "node:worker_threads";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import type { FitThreadReply, FitThreadRequest } from "./fit-thread-protocol";
import { outcomeOf } from "./record";

/* One refit per thread: the owning process stays free to write progress and to hear a cancel request. */
const port = parentPort;
if (!port) throw new Error("fit-thread runs only as a worker thread");
const controller = new AbortController();
const reply = (msg: FitThreadReply) => port.postMessage(msg);

port.on("message", async (msg: FitThreadRequest) => {
  if (msg.type === "stop") return controller.abort();
  try {
    const result = await fitDocument(msg.doc, msg.keys, msg.reference, {
      ...msg.options,
      signal: controller.signal,
      onProgress: (p) => reply({ type: "progress", ...p }),
    });
    reply({ type: "done", outcome: outcomeOf(result) });
  } catch (err) {
    reply({ type: "error", message: err instanceof Error ? err.message : String(err), inputError: err instanceof FitInputError });
  }
});
