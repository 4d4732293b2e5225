import { describe, expect, it } from "vitest";
import { navigationFor } from "@/lib/auth/navigation";
import { hasAnyRole, isRole, normaliseRoles } from "@/lib/auth/roles";
import { isThrottled, MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_IP } from "@/lib/auth/rate-limit";
import { signInErrorMessage } from "@/lib/auth/sign-in-messages";

describe("roles", () => {
  it("recognises only the five roles", () => {
    expect(isRole("curator")).toBe(true);
    expect(isRole("superuser")).toBe(false);
  });
  it("normalises order and drops duplicates", () => {
    expect(normaliseRoles(["admin", "author", "admin"])).toEqual(["author", "admin"]);
  });
  it("matches any of the wanted roles", () => {
    expect(hasAnyRole(["reviewer"], ["admin", "reviewer"])).toBe(true);
    expect(hasAnyRole(["reviewer"], ["admin"])).toBe(false);
  });
});

describe("navigation by role", () => {
  const hrefs = (roles: Parameters<typeof navigationFor>[0]) => navigationFor(roles).map((i) => i.href);
  it("shows admin pages to admins only", () => {
    expect(hrefs(["admin"])).toContain("/admin/people");
    expect(hrefs(["admin"])).toContain("/admin/mailbox");
    for (const role of ["author", "reviewer", "curator", "consumer"] as const) {
      expect(hrefs([role])).not.toContain("/admin/people");
      expect(hrefs([role])).not.toContain("/admin/mailbox");
    }
  });
  it("lets curators read the audit trail", () => {
    expect(hrefs(["curator"])).toContain("/admin/audit");
    expect(hrefs(["author"])).not.toContain("/admin/audit");
  });
  it("gives everyone the overview, the registry, API tokens and their account", () => {
    expect(hrefs([])).toEqual(["/", "/families", "/registry", "/settings/tokens", "/account"]);
  });
  it("shows the review board to those who take part in review, not to consumers", () => {
    for (const role of ["author", "reviewer", "curator", "admin"] as const) expect(hrefs([role])).toContain("/board");
    expect(hrefs(["consumer"])).not.toContain("/board");
  });
});

describe("sign-in throttling", () => {
  it("lets the attempts up to each limit through (counts include the attempt itself) and refuses the next", () => {
    expect(isThrottled({ account: MAX_FAILURES_PER_ACCOUNT, address: 1 })).toBe(false);
    expect(isThrottled({ account: MAX_FAILURES_PER_ACCOUNT + 1, address: 1 })).toBe(true);
    expect(isThrottled({ account: 1, address: MAX_FAILURES_PER_IP })).toBe(false);
    expect(isThrottled({ account: 1, address: MAX_FAILURES_PER_IP + 1 })).toBe(true);
  });
  it("turns codes into messages without revealing which part was wrong", () => {
    expect(signInErrorMessage("signin-failed")).toMatch(/do not match/);
    expect(signInErrorMessage("signin-throttled")).toMatch(/Too many failed/);
    expect(signInErrorMessage(null)).toBeNull();
  });
});
