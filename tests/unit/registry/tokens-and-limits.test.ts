import { describe, expect, it } from "vitest";
import { decideRate, rateHeaders, rateWindowStart } from "@/lib/registry/rate-limit";
import { bearerToken, generateApiToken, hashApiToken, looksLikeApiToken, scopeAllows } from "@/lib/registry/tokens";

describe("API tokens", () => {
  it("are random, recognisable, and stored as their sha256 only", () => {
    const a = generateApiToken(), b = generateApiToken();
    expect(a.token).not.toBe(b.token);
    expect(looksLikeApiToken(a.token)).toBe(true);
    expect(a.hash).toBe(hashApiToken(a.token));
    expect(a.token.startsWith(a.prefix)).toBe(true);
    expect(a.prefix.length).toBeLessThan(12);
  });

  it("hash with SHA-256 (FIPS 180-2, Appendix B.1: sha256('abc'))", () => {
    expect(hashApiToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("are read from a Bearer header only", () => {
    expect(bearerToken("Bearer bgt_x")).toBe("bgt_x");
    expect(bearerToken("bearer   bgt_x ")).toBe("bgt_x");
    expect(bearerToken("Basic dXNlcjpwYXNz")).toBeNull();
    expect(bearerToken("Bearer")).toBeNull();
    expect(bearerToken(null)).toBeNull();
    expect(looksLikeApiToken("bgt_short")).toBe(false);
  });

  it("with the read scope allow reading only", () => {
    expect(scopeAllows("read", "GET")).toBe(true);
    expect(scopeAllows("read", "HEAD")).toBe(true);
    expect(scopeAllows("read", "POST")).toBe(false);
    expect(scopeAllows("write", "GET")).toBe(false);
  });
});

describe("rate limit per token", () => {
  const now = new Date("2026-03-01T12:34:50.250Z");

  it("counts in fixed one-minute windows", () => {
    expect(rateWindowStart(now).toISOString()).toBe("2026-03-01T12:34:00.000Z");
  });

  it("allows up to the limit and refuses the next request until the window resets", () => {
    expect(decideRate(5, 5, now)).toMatchObject({ allowed: true, remaining: 0 });
    const refused = decideRate(6, 5, now);
    expect(refused).toMatchObject({ allowed: false, remaining: 0, resetSeconds: 10 });
    expect(rateHeaders(refused)["Retry-After"]).toBe("10");
    expect(rateHeaders(decideRate(1, 5, now))["Retry-After"]).toBeUndefined();
  });

  it("never asks to wait less than a second", () => {
    expect(decideRate(9, 1, new Date("2026-03-01T12:34:59.900Z")).resetSeconds).toBe(1);
  });
});
