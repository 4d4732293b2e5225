import { parentPort } from "node:worker_threads";
import { renderUserMarkdown } from "./render";
import type { RenderReply, RenderRequest } from "./render-protocol";

/** Thread side of render-in-thread.ts: renders one text per message, in order. */
parentPort?.on("message", ({ id, text }: RenderRequest) => {
  let reply: RenderReply;
  try {
    reply = { id, ok: true, rendered: renderUserMarkdown(text) };
  } catch (error) {
    reply = { id, ok: false, message: error instanceof Error ? error.message : String(error) };
  }
  parentPort?.postMessage(reply);
});
