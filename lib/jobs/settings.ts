import { z } from "zod";
import { parseNetworks } from "@/lib/registry/webhook-target";

/** Job-queue settings, read and validated once; the defaults suit production, tests shorten the retry delay. */
const schema = z.object({
  JOBS_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(1),
  WEBHOOK_RETRY_LIMIT: z.coerce.number().int().min(0).max(20).default(8),
  /** Base delay; pg-boss doubles it on each retry (with jitter): 15 s, 30 s, 1 min, … about 1 h by the 8th. */
  WEBHOOK_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).default(15),
  WEBHOOK_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(10_000),
  /** Networks (comma-separated CIDR) webhooks may reach although they are not public, e.g. a local receiver's 127.0.0.1/32. */
  WEBHOOK_ALLOW_NETWORKS: z
    .string()
    .default("")
    .transform((text, ctx) => {
      try {
        return parseNetworks(text);
      } catch (err) {
        ctx.addIssue({ code: "custom", message: err instanceof Error ? err.message : String(err) });
        return z.NEVER;
      }
    }),
  /** Refits one worker process runs at once, each in its own thread. Default: the machine's cores. */
  FIT_CONCURRENCY: z.coerce.number().int().min(1).max(64).optional(),
  /** A refit is stopped at its best point ("not converged") after this long; its job expires a minute later. */
  FIT_TIME_LIMIT_SECONDS: z.coerce.number().int().min(10).max(24 * 3600).default(1800),
  /** Crashes a refit survives (its worker died or its thread failed); the next one fails it. Graceful stops never count. */
  FIT_RETRY_LIMIT: z.coerce.number().int().min(0).max(10).default(2),
  /** A running refit whose heartbeat is this old belongs to a dead worker: it counts a crash and is run again. */
  FIT_STALL_SECONDS: z.coerce.number().int().min(5).max(3600).default(60),
  /** How often a running refit writes progress (and looks for a cancel request). */
  FIT_PROGRESS_MS: z.coerce.number().int().min(100).max(1000).default(400),
});

export type JobSettings = z.infer<typeof schema>;

let cached: JobSettings | undefined;

export function jobSettings(): JobSettings {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) throw new Error(`Invalid job settings: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  cached = parsed.data;
  return cached;
}
