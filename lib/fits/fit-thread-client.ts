import type { DocumentFitProgress } from "@/lib/tb/analysis/fit-document";
import { startModuleWorker } from "@/lib/tb/worker-start";
import type { FitThreadReply, FitThreadRequest } from "./fit-thread-protocol";
import type { FitOutcome } from "./record";

export class FitThreadError extends Error {
  constructor(
    message: string,
    readonly inputError: boolean,
  ) {
    super(message);
    this.name = "FitThreadError";
  }
}

export interface FitThread {
  /** Resolves with the outcome (also for a stopped fit: its best point); rejects if the thread fails or dies. */
  result: Promise<FitOutcome>;
  /** Asks the fit to stop at its next iteration. */
  stop(): void;
  /** Ends the thread at once (after result settled, or as a last resort). */
  terminate(): Promise<void>;
}

export function runFitInThread(request: Extract<FitThreadRequest, { type: "run" }>, onProgress: (p: DocumentFitProgress) => void): FitThread {
  const thread = startModuleWorker(import.meta.url, "fit-thread");
  const result = new Promise<FitOutcome>((resolve, reject) => {
    thread.on("message", (msg: FitThreadReply) => {
      if (msg.type === "progress") onProgress(msg);
      else if (msg.type === "done") resolve(msg.outcome);
      else reject(new FitThreadError(msg.message, msg.inputError));
    });
    thread.on("error", (err) => reject(new FitThreadError(`the fit thread crashed: ${err.message}`, false)));
    thread.on("exit", (code) => reject(new FitThreadError(`the fit thread exited (code ${code}) before finishing`, false)));
  });
  thread.postMessage(request satisfies FitThreadRequest);
  return {
    result,
    stop: () => thread.postMessage({ type: "stop" } satisfies FitThreadRequest),
    terminate: async () => {
      await thread.terminate();
    },
  };
}
