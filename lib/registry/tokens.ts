import { createHash, randomBytes, timingSafeEqual } from "node:crypto";

/** API tokens: "bgt_" + 32 random bytes (base64url). Only the sha256 is stored; the token is shown once. */
const TOKEN_PATTERN = /^bgt_[A-Za-z0-9_-]{43}$/;

/** Active (unrevoked) tokens one person may hold: each token has its own rate limit, so more tokens mean more load. */
export const API_TOKEN_LIMIT = 10;

export const TOKEN_SCOPES = ["read"] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];

export function generateApiToken(): { token: string; hash: string; prefix: string } {
  const token = `bgt_${randomBytes(32).toString("base64url")}`;
  return { token, hash: hashApiToken(token), prefix: token.slice(0, 10) };
}

export function hashApiToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function looksLikeApiToken(text: string): boolean {
  return TOKEN_PATTERN.test(text);
}

/** The token of an `Authorization: Bearer <token>` header, or null when the header is absent or of another kind. */
export function bearerToken(header: string | null): string | null {
  if (!header) return null;
  const m = /^Bearer[ ]+(\S+)\s*$/i.exec(header);
  return m ? m[1] : null;
}

/** Read-only tokens may do what GET does, nothing else. */
export function scopeAllows(scope: string, method: string): boolean {
  return scope === "read" && (method === "GET" || method === "HEAD");
}

export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, "hex"), y = Buffer.from(b, "hex");
  return x.length === y.length && timingSafeEqual(x, y);
}
