import { describe, expect, it } from "vitest";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { findNul, NUL_MESSAGE, withoutNul } from "@/lib/pg-text";
import { assertSameOriginJson, originsOf } from "@/lib/request-guard";
import { contentSecurityPolicy, STATIC_SECURITY_HEADERS, transportSecurity } from "@/lib/security-headers";

const origins = originsOf(["https://bandgate.example/", "https://bandgate.example", undefined]);

function refusal(init: { method: string; headers?: Record<string, string> }): string | null {
  try {
    assertSameOriginJson(new Request("https://bandgate.example/api/x", init), origins);
    return null;
  } catch (err) {
    return err instanceof AppError ? err.code : String(err);
  }
}

describe("state-changing requests must come from the app's origin, as JSON", () => {
  const json = { "content-type": "application/json; charset=utf-8" };
  it("lets reads through whatever they carry", () => {
    expect(origins).toEqual(["https://bandgate.example"]);
    expect(refusal({ method: "GET", headers: { origin: "https://evil.example" } })).toBeNull();
  });
  it("accepts the app's own origin with JSON, with or without Sec-Fetch-Site", () => {
    expect(refusal({ method: "POST", headers: { origin: "https://bandgate.example", ...json } })).toBeNull();
    expect(refusal({ method: "PATCH", headers: { origin: "https://bandgate.example", "sec-fetch-site": "same-origin", ...json } })).toBeNull();
  });
  it("refuses another origin, another port, a missing or opaque origin, and any cross-site fetch", () => {
    for (const origin of ["https://evil.example", "https://bandgate.example:8443", "http://bandgate.example", "null"]) {
      expect(refusal({ method: "POST", headers: { origin, ...json } })).toBe("forbidden:origin");
    }
    expect(refusal({ method: "DELETE", headers: json })).toBe("forbidden:origin");
    for (const site of ["same-site", "cross-site", "none"]) {
      expect(refusal({ method: "POST", headers: { origin: "https://bandgate.example", "sec-fetch-site": site, ...json } })).toBe("forbidden:origin");
    }
  });
  it("refuses bodies a form can send (text/plain, urlencoded, multipart) and none at all with 415", () => {
    for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]) {
      expect(refusal({ method: "POST", headers: { origin: "https://bandgate.example", "content-type": type } })).toBe("unsupported:media-type");
    }
    expect(refusal({ method: "POST", headers: { origin: "https://bandgate.example" } })).toBe("unsupported:media-type");
  });
});

describe("NUL in text bound for PostgreSQL", () => {
  it("the shared refinement refuses it and keeps the string schema's methods", () => {
    const name = withoutNul(z.string()).trim().min(2);
    expect(name.safeParse(" ok ").data).toBe("ok");
    expect(name.safeParse("a\u0000b").error?.issues[0].message).toBe(NUL_MESSAGE);
  });
  it("finds it anywhere in a JSON value, keys included, and names where", () => {
    expect(findNul({ a: [1, { b: "fine" }], c: null })).toBeNull();
    expect(findNul({ a: [1, { b: "x\u0000" }] })).toBe("a.1.b");
    expect(findNul({ ["k\u0000"]: 1 })).toBe("k\\u0000");
    expect(findNul("\u0000")).toBe("_form");
  });
});

describe("security headers", () => {
  it("a nonce policy without inline or eval scripts in production, with eval and a WebSocket only in development", () => {
    const prod = contentSecurityPolicy("abc", { dev: false });
    expect(prod).toContain("script-src 'self' 'nonce-abc' 'strict-dynamic';");
    expect(prod).not.toMatch(/unsafe-eval|ws:/);
    expect(prod).toContain("frame-ancestors 'none'");
    const dev = contentSecurityPolicy("abc", { dev: true });
    expect(dev).toContain("'unsafe-eval'");
    expect(dev).toContain("connect-src 'self' ws:");
  });
  it("HSTS only when the app is served over https", () => {
    expect(transportSecurity("https://bandgate.example")).toBe("max-age=31536000");
    expect(transportSecurity("http://localhost:3000")).toBeNull();
    expect(STATIC_SECURITY_HEADERS.map((h) => h.key)).toEqual(["X-Content-Type-Options", "Referrer-Policy", "Permissions-Policy"]);
  });
});
