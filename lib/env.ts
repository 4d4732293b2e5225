import { z } from "zod";

const envSchema = z.object({
  /** The web app and the worker connect as this role: row access only, owns nothing (README: Database roles). */
  DATABASE_URL: z.string().url().default("postgres://bandgate_app@127.0.0.1:54329/bandgate"),
  /** The migration step connects as the owner of the tables; DATABASE_URL when unset (one role, no separation). */
  MIGRATION_DATABASE_URL: z.string().url().optional(),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  APP_URL: z.string().url().default("http://localhost:3000"),
  NEXTAUTH_URL: z.string().url().optional(),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Bandgate <bandgate@localhost>"),
  BANDGATE_ENV: z.enum(["production", "development", "test"]).default("production"),
  /** Reverse proxies in front of the web server that append to X-Forwarded-For; 0 = clients connect directly. */
  TRUSTED_PROXY_COUNT: z.coerce.number().int().min(0).max(10).default(0),
  /** Largest basis (states of H(k): orbitals per cell, twice that with spin–orbit) a saved or uploaded model may have. */
  MODEL_BASIS_LIMIT: z.coerce.number().int().min(1).max(2048).default(64),
  /** Worker threads that run engine computations for web requests. Default: cores − 1, at least 2, at most 4. */
  ENGINE_THREADS: z.coerce.number().int().min(1).max(64).optional(),
  /** Computations that may wait for a thread; more are refused at once as "busy". */
  ENGINE_QUEUE_LIMIT: z.coerce.number().int().min(0).max(10_000).default(64),
  /** A computation running (or waiting) longer than this is stopped and its thread replaced. */
  ENGINE_TASK_TIMEOUT_SECONDS: z.coerce.number().min(1).max(3600).default(60),
});

export type ServerEnv = z.infer<typeof envSchema>;

let cached: ServerEnv | undefined;

/** The server's configuration, read and validated once. */
export function serverEnv(): ServerEnv {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const detail = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Invalid environment: ${detail}`);
  }
  cached = parsed.data;
  return cached;
}
