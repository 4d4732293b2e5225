import { z } from "zod";

/** The harness's settings, from the environment scripts/reliability.sh exports; read and validated once. */
const schema = z.object({
  RELIABILITY_WEB_PORT: z.coerce.number().int().min(1).max(65535),
  RELIABILITY_PG_PORT: z.coerce.number().int().min(1).max(65535),
  RELIABILITY_PG_DATA: z.string().min(1),
  RELIABILITY_RUN_DIR: z.string().min(1),
  PGBIN: z.string().min(1),
  DATABASE_URL: z.string().url(),
  /** The webhook receiver's port; 0 takes any free one. */
  RELIABILITY_HOOK_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  /** Seed of the bad-input generator: the same seed sends the same inputs. */
  RELIABILITY_SEED: z.coerce.number().int().min(0).default(11),
  /** How long a fault scenario may take to finish its jobs after the worker is back before it counts as lost. */
  RELIABILITY_RECOVERY_SECONDS: z.coerce.number().int().min(30).max(3600).default(240),
  /** How long PostgreSQL stays down in the restart scenario. */
  RELIABILITY_PG_DOWN_SECONDS: z.coerce.number().min(0).max(120).default(3),
});

export type ReliabilitySettings = z.infer<typeof schema> & { baseUrl: string };

let cached: ReliabilitySettings | undefined;

export function reliabilitySettings(): ReliabilitySettings {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const detail = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`run the harness through scripts/reliability.sh (${detail})`);
  }
  cached = { ...parsed.data, baseUrl: `http://127.0.0.1:${parsed.data.RELIABILITY_WEB_PORT}` };
  return cached;
}
