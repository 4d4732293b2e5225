import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { errorHint } from "../error-hint";
import type { BadCase, CaseContext } from "./case";

/**
 * Row counts of every table a route could write (and the version sums that an update would move), in one
 * statement. Mail, sign-in attempts and API rate windows are left out: they change for reasons of their own.
 */
const SNAPSHOT = sql`select
  (select count(*) from proposals)::int as proposals,
  (select coalesce(sum(version), 0) from proposals)::int as "proposal versions",
  (select count(*) from revisions)::int as revisions,
  (select count(*) from reference_band_sets)::int as reference_band_sets,
  (select count(*) from remarks)::int as remarks,
  (select coalesce(sum(version), 0) from remarks)::int as "remark versions",
  (select count(*) from verdicts)::int as verdicts,
  (select count(*) from reviewer_assignments)::int as reviewer_assignments,
  (select count(*) from audit_events)::int as audit_events,
  (select count(*) from model_families)::int as model_families,
  (select count(*) from releases)::int as releases,
  (select count(*) from release_events)::int as release_events,
  (select count(*) from webhook_subscriptions)::int as webhook_subscriptions,
  (select count(*) from family_subscriptions)::int as family_subscriptions,
  (select count(*) from api_tokens)::int as api_tokens,
  (select count(*) from users)::int as users,
  (select count(*) from fit_runs)::int as fit_runs`;

export type Snapshot = Record<string, number>;

export async function snapshot(): Promise<Snapshot> {
  const result = await db.execute<Snapshot>(SNAPSHOT);
  return result.rows[0];
}

export function changedTables(before: Snapshot, after: Snapshot): string[] {
  return Object.keys(before).filter((k) => before[k] !== after[k]).map((k) => `${k} ${before[k]}→${after[k]}`);
}

export interface Outcome {
  c: BadCase;
  status: number | null;
  error: string | null;
  ms: number;
  /** The app said no (4xx, or a server action's `ok: false`). */
  refused: boolean;
  /** Tables whose counts moved while a refused, failed or read-only request ran. */
  partial: string[];
  /** For a failure: what the server printed about it. */
  hint: string | null;
}

export interface Credentials {
  cookie: string;
  token: string;
  base: string;
  /** The web server's output, to quote its own error for a failed request. */
  server: { mark(): number; outputSince(mark: number): string };
}

/** Whatever the server answered, the request's own ceiling: past it the request counts as failed (and slow). */
const REQUEST_CEILING_MS = 180_000;

/** A server action answers 200 with its result in the flight stream: `"ok":false` is a refusal. */
function actionRefused(status: number, text: string): boolean {
  if (status >= 400) return true;
  if (/"ok":\s*true/.test(text)) return false;
  return true;
}

/** Sends one case with the given credentials, and compares the tables before and after it. */
export async function sendCase(c: BadCase, ctx: CaseContext, creds: Credentials): Promise<Outcome> {
  const spec = await c.build(ctx);
  const headers = new Headers(spec.headers);
  if (c.auth === "author") headers.set("cookie", creds.cookie);
  if (c.auth === "token" && !headers.has("authorization")) headers.set("authorization", `Bearer ${creds.token}`);
  // As a browser sends it on every POST: the inputs must reach the route's own checks, not stop at a cross-site guard.
  if (spec.method === "POST" && !headers.has("origin")) headers.set("origin", creds.base);
  const before = await snapshot();
  const mark = creds.server.mark();
  const t0 = performance.now();
  let status: number | null = null;
  let error: string | null = null;
  let text = "";
  try {
    const body = Buffer.isBuffer(spec.body) ? new Uint8Array(spec.body) : spec.body;
    const res = await fetch(creds.base + spec.path, { method: spec.method, headers, body, redirect: "manual", signal: AbortSignal.timeout(REQUEST_CEILING_MS) });
    text = await res.text();
    status = res.status;
  } catch (err) {
    error = err instanceof Error ? `${err.name}: ${(err.cause as Error | undefined)?.message ?? err.message}` : String(err);
  }
  const ms = performance.now() - t0;
  const after = await snapshot();
  const refused = status === null || status >= 400 || (c.judge === "action" && actionRefused(status, text));
  const readOnly = spec.method === "GET";
  const moved = changedTables(before, after);
  const failed = status === null || status >= 500;
  return { c, status, error, ms, refused, partial: refused || readOnly || failed ? moved : [], hint: failed ? (errorHint(creds.server.outputSince(mark)) ?? "the app printed nothing") : null };
}
