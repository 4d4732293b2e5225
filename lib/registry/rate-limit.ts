/** Fixed one-minute windows per token; the count lives in PostgreSQL (api_rate_windows). */
export const RATE_WINDOW_SECONDS = 60;

export function rateWindowStart(now: Date): Date {
  const ms = RATE_WINDOW_SECONDS * 1000;
  return new Date(Math.floor(now.getTime() / ms) * ms);
}

export interface RateDecision {
  allowed: boolean;
  limit: number;
  remaining: number;
  /** Whole seconds until the window resets (at least 1). */
  resetSeconds: number;
}

/** `hits` counts this request too. */
export function decideRate(hits: number, limit: number, now: Date): RateDecision {
  const end = rateWindowStart(now).getTime() + RATE_WINDOW_SECONDS * 1000;
  return {
    allowed: hits <= limit,
    limit,
    remaining: Math.max(0, limit - hits),
    resetSeconds: Math.max(1, Math.ceil((end - now.getTime()) / 1000)),
  };
}

export function rateHeaders(d: RateDecision): Record<string, string> {
  const headers: Record<string, string> = {
    "RateLimit-Limit": String(d.limit),
    "RateLimit-Remaining": String(d.remaining),
    "RateLimit-Reset": String(d.resetSeconds),
  };
  if (!d.allowed) headers["Retry-After"] = String(d.resetSeconds);
  return headers;
}
