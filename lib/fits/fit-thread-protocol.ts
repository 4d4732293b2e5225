import type { ReferenceBands } from "@/lib/tb/analysis/compare-reference";
import type { DocumentFitOptions, DocumentFitProgress } from "@/lib/tb/analysis/fit-document";
import type { ModelDocument } from "@/lib/tb/document";
import type { FitOutcome } from "./record";

/** Messages between a fit thread and the process that owns it (structured clone: Infinity bounds survive). */
export type FitThreadRequest =
  | { type: "run"; doc: ModelDocument; keys: string[]; reference: ReferenceBands; options: Omit<DocumentFitOptions, "onProgress" | "signal"> }
  | { type: "stop" };

export type FitThreadReply =
  | ({ type: "progress" } & DocumentFitProgress)
  | { type: "done"; outcome: FitOutcome }
  | { type: "error"; message: string; inputError: boolean };
