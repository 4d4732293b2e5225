import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { AppError } from "@/lib/errors";
import { decideRate, rateWindowStart, type RateDecision } from "./rate-limit";
import { bearerToken, hashApiToken, looksLikeApiToken, scopeAllows } from "./tokens";

export interface ApiCaller {
  tokenId: string;
  userId: string;
  rate: RateDecision;
}

const unauthenticated = (message: string) => new AppError("unauthenticated:token", message);

interface TokenRow extends Record<string, unknown> {
  id: string;
  user_id: string;
  scope: string;
  requests_per_minute: number;
  revoked_at: Date | null;
  active: boolean;
  hits: number | null;
}

/**
 * Bearer token → caller, in one statement: look the token up by its hash, stamp its last use (at most every few
 * seconds) and count the request in the token's current one-minute window. Missing, unknown and revoked tokens are
 * 401; a count above the token's limit is 429 with the seconds until the window resets.
 */
export async function authenticateApiRequest(request: Request, now = new Date()): Promise<ApiCaller> {
  const token = bearerToken(request.headers.get("authorization"));
  if (!token) throw unauthenticated("Send an API token: Authorization: Bearer <token> (create one under Settings → API tokens).");
  if (!looksLikeApiToken(token)) throw unauthenticated("That is not a Bandgate API token.");
  const result = await db.execute<TokenRow>(sql`
    with t as (
      select k.id, k.user_id, k.scope, k.requests_per_minute, k.revoked_at, u.active
      from api_tokens k join users u on u.id = k.user_id
      where k.token_hash = ${hashApiToken(token)}
    ),
    ok as (select id from t where revoked_at is null and active),
    touch as (
      update api_tokens set last_used_at = ${now}
      where id in (select id from ok) and (last_used_at is null or last_used_at < ${now}::timestamptz - interval '5 seconds')
    ),
    hit as (
      insert into api_rate_windows (token_id, window_start, hits)
      select id, ${rateWindowStart(now)}, 1 from ok
      on conflict (token_id, window_start) do update set hits = api_rate_windows.hits + 1
      returning hits
    )
    select t.*, (select hits from hit) as hits from t`);
  const row = result.rows[0];
  if (!row) throw unauthenticated("Unknown API token.");
  if (row.revoked_at) throw unauthenticated("This API token was revoked.");
  if (!row.active || row.hits === null) throw unauthenticated("The account of this API token is deactivated.");
  if (!scopeAllows(row.scope, request.method)) throw new AppError("forbidden:scope", "This token is read-only.");
  const rate = decideRate(row.hits, row.requests_per_minute, now);
  if (!rate.allowed) {
    throw new AppError("rate-limited:token", `Rate limit reached: ${rate.limit} requests per minute for this token. Retry in ${rate.resetSeconds} s.`, undefined, { rate });
  }
  return { tokenId: row.id, userId: row.user_id, rate };
}
