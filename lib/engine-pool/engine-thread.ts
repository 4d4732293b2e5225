import { parentPort } from "node:worker_threads";
import type { EngineReply, EngineRequest } from "./protocol";
import { ENGINE_TASKS } from "./tasks";

/* An engine thread: runs one task at a time for the pool (engine-pool.ts), which times it and replaces a stuck thread. */
const port = parentPort;
if (!port) throw new Error("engine-thread runs only as a worker thread");

port.on("message", (msg: EngineRequest) => {
  let reply: EngineReply;
  try {
    const run = ENGINE_TASKS[msg.task] as (...args: unknown[]) => unknown;
    reply = { id: msg.id, ok: true, value: run(...msg.args) };
  } catch (err) {
    reply = { id: msg.id, ok: false, name: err instanceof Error ? err.name : "Error", message: err instanceof Error ? err.message : String(err) };
  }
  try {
    port.postMessage(reply);
  } catch (err) {
    port.postMessage({ id: msg.id, ok: false, name: "DataCloneError", message: `the result could not be sent back: ${err instanceof Error ? err.message : String(err)}` } satisfies EngineReply);
  }
});
