import type { EngineTaskName } from "./tasks";

/** Messages between the pool and an engine thread; arguments and results travel by structured clone. */
export interface EngineRequest {
  id: number;
  task: EngineTaskName;
  args: unknown[];
}

export type EngineReply = { id: number; ok: true; value: unknown } | { id: number; ok: false; name: string; message: string };
