import { performance } from "node:perf_hooks";

export interface HealthWatch {
  /** Latency of each /api/health answer (ms), in the order they came. */
  latencies: number[];
  worst: number;
}

/**
 * Asks /api/health again as soon as it answers, for as long as `work` runs, and records how long each answer took:
 * a web process whose event loop is busy cannot answer until it is free again.
 */
export async function watchHealthDuring<T>(base: string, work: Promise<T>): Promise<{ result: T; health: HealthWatch }> {
  let done = false;
  const settled = work.finally(() => {
    done = true;
  });
  const latencies: number[] = [];
  const poll = (async () => {
    while (!done) {
      const t0 = performance.now();
      const res = await fetch(`${base}/api/health`);
      await res.arrayBuffer();
      if (res.status !== 200) throw new Error(`/api/health answered ${res.status}`);
      latencies.push(performance.now() - t0);
    }
  })();
  const [result] = await Promise.all([settled, poll]);
  return { result, health: { latencies, worst: Math.max(0, ...latencies) } };
}
