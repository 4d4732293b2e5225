import { Agent, request } from "node:http";

export interface Sample {
  /** performance.now() when sent and when the answer (or the error) was complete. */
  sent: number;
  done: number;
  status: number | null;
  error: string | null;
  retryAfter: string | null;
  remaining: string | null;
}

export interface LoadOptions {
  port: number;
  path: string;
  headers: Record<string, string>;
  clients: number;
  /** Sending stops when this returns true (checked before each request). */
  stop: () => boolean;
  /** A request with no complete answer after this long is abandoned and recorded as an error. */
  abandonMs: number;
}

function once(agent: Agent, o: LoadOptions): Promise<Sample> {
  const sent = performance.now();
  return new Promise((resolve) => {
    const finish = (status: number | null, error: string | null, h: Record<string, string | string[] | undefined> = {}) =>
      resolve({ sent, done: performance.now(), status, error, retryAfter: (h["retry-after"] as string | undefined) ?? null, remaining: (h["ratelimit-remaining"] as string | undefined) ?? null });
    const req = request({ host: "127.0.0.1", port: o.port, path: o.path, agent, headers: o.headers }, (res) => {
      res.resume();
      res.on("end", () => finish(res.statusCode ?? null, null, res.headers));
      res.on("error", (err) => finish(null, err.message));
    });
    req.setTimeout(o.abandonMs, () => req.destroy(new Error(`no answer within ${o.abandonMs / 1000} s`)));
    req.on("error", (err) => finish(null, (err as NodeJS.ErrnoException).code ?? err.message));
    req.end();
  });
}

/** Closed loop: `clients` keep-alive connections, each sending its next request when the last one is answered. */
export async function runLoad(o: LoadOptions, onSample?: (s: Sample) => void): Promise<Sample[]> {
  const agent = new Agent({ keepAlive: true, maxSockets: o.clients });
  const samples: Sample[] = [];
  await Promise.all(
    Array.from({ length: o.clients }, async () => {
      while (!o.stop()) {
        const s = await once(agent, o);
        samples.push(s);
        onSample?.(s);
      }
    }),
  );
  agent.destroy();
  return samples;
}

export function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((sorted.length * p) / 100))];
}

export function latencySummary(samples: Sample[]): string {
  const ms = samples.map((s) => s.done - s.sent).sort((a, b) => a - b);
  const f = (v: number) => (v >= 100 ? v.toFixed(0) : v.toFixed(1));
  return `p50 ${f(percentile(ms, 50))} ms, p90 ${f(percentile(ms, 90))} ms, p99 ${f(percentile(ms, 99))} ms, max ${f(ms.at(-1) ?? NaN)} ms`;
}

export function countBy<T>(items: T[], key: (t: T) => string): Map<string, number> {
  const out = new Map<string, number>();
  for (const it of items) out.set(key(it), (out.get(key(it)) ?? 0) + 1);
  return out;
}

export function statusLabel(s: Sample): string {
  return s.status === null ? `error ${s.error}` : String(s.status);
}
