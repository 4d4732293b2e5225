import { describe, expect, it } from "vitest";
import { ifNoneMatchHits, releaseEtag } from "@/lib/registry/etag";
import { signWebhookBody, verifyWebhookSignature } from "@/lib/registry/signing";

describe("ETag of a release", () => {
  const sha = "9f86d081884c7d659a2feaa0c55ad015a3bf4f1b2b0b822cd15d6c15b0f00a08";
  const etag = releaseEtag(sha);

  it("is the quoted sha256", () => {
    expect(etag).toBe(`"${sha}"`);
  });

  it("matches If-None-Match by weak comparison, in lists and for * (RFC 9110 §13.1.2)", () => {
    expect(ifNoneMatchHits(etag, etag)).toBe(true);
    expect(ifNoneMatchHits(`W/${etag}`, etag)).toBe(true);
    expect(ifNoneMatchHits(`"other", ${etag}`, etag)).toBe(true);
    expect(ifNoneMatchHits("*", etag)).toBe(true);
    expect(ifNoneMatchHits(sha, etag)).toBe(false);
    expect(ifNoneMatchHits('"other"', etag)).toBe(false);
    expect(ifNoneMatchHits(null, etag)).toBe(false);
  });
});

describe("webhook signature", () => {
  it("is HMAC-SHA256 of the body (RFC 4231, test case 2)", () => {
    expect(signWebhookBody("Jefe", "what do ya want for nothing?")).toBe("hmac-sha256=5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843");
  });

  it("verifies the exact body and secret only", () => {
    const body = JSON.stringify({ event: "release.published", release: { version: "1.2.0" } });
    const header = signWebhookBody("a-secret-of-16-chars", body);
    expect(verifyWebhookSignature("a-secret-of-16-chars", body, header)).toBe(true);
    expect(verifyWebhookSignature("a-secret-of-16-chars", body.replace("1.2.0", "1.2.1"), header)).toBe(false);
    expect(verifyWebhookSignature("another-secret-16ch", body, header)).toBe(false);
    expect(verifyWebhookSignature("a-secret-of-16-chars", body, null)).toBe(false);
  });
});
