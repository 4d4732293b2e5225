import { createHmac, timingSafeEqual } from "node:crypto";

/** Webhook bodies are signed with HMAC-SHA256 of the exact body bytes, keyed with the subscription's secret. */
export const SIGNATURE_HEADER = "Bandgate-Signature";
export const SIGNATURE_SCHEME = "hmac-sha256";

export function signWebhookBody(secret: string, body: string): string {
  return `${SIGNATURE_SCHEME}=${createHmac("sha256", secret).update(body, "utf8").digest("hex")}`;
}

export function verifyWebhookSignature(secret: string, body: string, header: string | null): boolean {
  if (!header) return false;
  const expected = Buffer.from(signWebhookBody(secret, body));
  const given = Buffer.from(header.trim());
  return expected.length === given.length && timingSafeEqual(expected, given);
}
