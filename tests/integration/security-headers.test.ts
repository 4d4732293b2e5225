import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";

afterAll(closeDb);

function directives(csp: string | null): Map<string, string[]> {
  expect(csp).toBeTruthy();
  return new Map(
    (csp ?? "")
      .split(";")
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name, values]),
  );
}

function nonceOf(csp: Map<string, string[]>): string {
  const nonce = csp.get("script-src")?.find((v) => v.startsWith("'nonce-"));
  expect(nonce).toBeTruthy();
  return nonce!.slice("'nonce-".length, -1);
}

function expectCommonHeaders(res: Response) {
  expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  const permissions = res.headers.get("permissions-policy") ?? "";
  for (const feature of ["camera", "microphone", "geolocation", "payment", "usb"]) expect(permissions).toContain(`${feature}=()`);
  // Served over plain http here: a browser ignores HSTS on http, and sending it would be wrong for this origin.
  expect(res.headers.get("strict-transport-security")).toBeNull();
}

/** Every <script> element in a page must carry the response's nonce, or the browser refuses to run it. */
function expectScriptsCarry(html: string, nonce: string) {
  const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
}

describe("security headers", () => {
  it("a page gets a per-request nonce policy that its own scripts carry, and the other headers", async () => {
    const session = new HttpSession(appUrl());
    const first = await session.fetch("/login");
    const second = await session.fetch("/login");
    expect(first.status).toBe(200);
    const csp = directives(first.headers.get("content-security-policy"));
    const nonce = nonceOf(csp);
    expect(nonce).toMatch(/^[A-Za-z0-9+/=_-]{16,}$/);
    expect(nonceOf(directives(second.headers.get("content-security-policy")))).not.toBe(nonce);
    expectScriptsCarry(await first.text(), nonce);
    await second.text();

    expect(csp.get("default-src")).toEqual(["'self'"]);
    expect(csp.get("script-src")).toEqual(expect.arrayContaining(["'strict-dynamic'"]));
    expect(csp.get("script-src")).not.toContain("'unsafe-inline'");
    expect(csp.get("script-src")).not.toContain("'unsafe-eval'");
    expect(csp.get("style-src")).toEqual(["'self'", "'unsafe-inline'"]);
    // blob: is for the band plot's PNG export (the SVG is drawn through an image).
    expect(csp.get("img-src")).toEqual(["'self'", "data:", "blob:"]);
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.get("object-src")).toEqual(["'none'"]);
    expect(csp.get("base-uri")).toEqual(["'self'"]);
    expect(csp.get("form-action")).toEqual(["'self'"]);
    expect(csp.get("worker-src")).toEqual(expect.arrayContaining(["'self'"]));
    expectCommonHeaders(first);
  });

  it("pages that could be prerendered are rendered per request, so their scripts carry the nonce too", async () => {
    const session = new HttpSession(appUrl());
    for (const path of ["/reset-password", "/no-such-page"]) {
      const res = await session.fetch(path);
      expectScriptsCarry(await res.text(), nonceOf(directives(res.headers.get("content-security-policy"))));
      expectCommonHeaders(res);
    }
    const person = await createPerson(["author", "reviewer"]);
    expect(await session.signIn(person.email, person.password)).toBeNull();
    for (const path of ["/board", "/registry", "/settings/tokens", "/proposals/new"]) {
      const res = await session.fetch(path);
      expect(res.status).toBe(200);
      expectScriptsCarry(await res.text(), nonceOf(directives(res.headers.get("content-security-policy"))));
    }
  });

  it("API answers, errors and static files carry the headers as well", async () => {
    const session = new HttpSession(appUrl());
    const health = await session.fetch("/api/health");
    expectCommonHeaders(health);
    expect(directives(health.headers.get("content-security-policy")).get("frame-ancestors")).toEqual(["'none'"]);
    const refused = await session.fetch("/api/admin/users");
    expect(refused.status).toBe(401);
    expectCommonHeaders(refused);
    const v1 = await session.fetch("/api/v1/families");
    expectCommonHeaders(v1);
    const schema = await session.fetch("/api/v1/schema/model-document");
    expectCommonHeaders(schema);

    const html = await (await session.fetch("/login")).text();
    const asset = html.match(/\/_next\/static\/[^"']+\.js/)?.[0];
    expect(asset).toBeTruthy();
    const res = await session.fetch(asset!);
    expect(res.status).toBe(200);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  });
});
