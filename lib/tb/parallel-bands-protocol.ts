/** Messages between parallel-bands.ts and its workers. Arrays in a batch live in SharedArrayBuffers. */

export interface BatchRequest {
  type: "batch";
  id: number;
  /** k-points, `dimension` numbers each. */
  k: Float64Array;
  /** Energies, `size` per k-point, written by whichever worker takes the k-point. */
  out: Float64Array;
  /** next[0]: first k-point not yet taken; workers advance it by `chunk` with Atomics.add. */
  next: Int32Array;
  count: number;
  chunk: number;
}

export type WorkerReply =
  | { type: "ready" }
  | { type: "done"; id: number }
  | { type: "error"; id: number; message: string };
