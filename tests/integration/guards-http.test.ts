import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditEvents, invitations, users } from "@/db/schema";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";

afterAll(closeDb);

async function signedIn(roles: Parameters<typeof createPerson>[0]) {
  const person = await createPerson(roles);
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return { person, session };
}

describe("route handlers refuse the wrong caller", () => {
  it("answers 401 with a JSON error to anonymous callers", async () => {
    const res = await new HttpSession(appUrl()).fetch("/api/admin/users");
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({ error: { code: "unauthenticated:session" } });
  });

  for (const role of ["author", "reviewer", "curator", "consumer"] as const) {
    it(`answers 403 to a ${role} calling admin endpoints directly, and changes nothing`, async () => {
      const { session } = await signedIn([role]);
      expect((await session.fetch("/api/admin/users")).status).toBe(403);
      const email = `direct-${randomUUID().slice(0, 8)}@test.invalid`;
      const res = await session.json("/api/admin/invitations", "POST", { email, name: "Sneaky", roles: ["admin"] });
      expect(res.status).toBe(403);
      expect(await res.json()).toMatchObject({ error: { code: "forbidden:role" } });
      expect(await db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(0);
    });
  }

  it("lets an admin list people without password hashes, and validates bodies", async () => {
    const { session } = await signedIn(["admin"]);
    const res = await session.fetch("/api/admin/users");
    expect(res.status).toBe(200);
    const body = await res.text();
    expect(body).toContain("@test.invalid");
    expect(body).not.toMatch(/password|\$2[aby]\$/i);

    const bad = await session.json("/api/admin/invitations", "POST", { email: "nope", name: "", roles: [] });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fieldErrors).toHaveProperty("email");
    const notJson = await session.fetch("/api/admin/invitations", { method: "POST", body: "{", headers: { "content-type": "application/json" } });
    expect(notJson.status).toBe(400);
  });

  it("answers 409 to a stale role change and 404 to an unknown person", async () => {
    const { person: admin, session } = await signedIn(["admin"]);
    const target = await createPerson(["author"]);
    expect((await session.json(`/api/admin/users/${target.id}`, "PATCH", { roles: ["reviewer"], version: 1 })).status).toBe(200);
    expect((await session.json(`/api/admin/users/${target.id}`, "PATCH", { roles: ["curator"], version: 1 })).status).toBe(409);
    expect((await session.json(`/api/admin/users/not-a-uuid`, "PATCH", { roles: [], version: 1 })).status).toBe(404);
    const events = await db.select().from(auditEvents).where(eq(auditEvents.subjectId, target.id));
    expect(events.filter((e) => e.action === "user.roles-changed" && e.actorId === admin.id)).toHaveLength(1);
  });

  it("drops a session at once when its account is deactivated", async () => {
    const { person, session } = await signedIn(["admin"]);
    expect((await session.fetch("/api/admin/users")).status).toBe(200);
    await db.update(users).set({ active: false }).where(eq(users.id, person.id));
    expect((await session.fetch("/api/admin/users")).status).toBe(401);
  });
});

describe("pages refuse the wrong caller", () => {
  it("sends anonymous visitors to sign-in with a way back", async () => {
    const res = await new HttpSession(appUrl()).fetch("/admin/people");
    expect([303, 307, 308]).toContain(res.status);
    expect(res.headers.get("location")).toContain("/login?callbackUrl=%2Fadmin%2Fpeople");
  });

  it("shows a 403 page to a reviewer opening an admin page, and the page to an admin", async () => {
    const { session } = await signedIn(["reviewer"]);
    const refused = await session.fetch("/admin/people");
    expect(refused.status).toBe(403);
    expect(await refused.text()).toContain("Not for your role");
    const { session: adminSession } = await signedIn(["admin"]);
    const page = await adminSession.fetch("/admin/people");
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Invite a person");
  });
});

describe("sign-in over HTTP", () => {
  it("reports wrong passwords and unknown addresses alike, and throttles with its own code", async () => {
    const person = await createPerson(["author"]);
    const session = new HttpSession(appUrl());
    expect(await session.signIn(person.email, "not-the-password")).toBe("signin-failed");
    expect(await session.signIn(`nobody-${randomUUID()}@test.invalid`, "whatever-password")).toBe("signin-failed");
    for (let i = 0; i < 4; i++) await session.signIn(person.email, "still-wrong");
    expect(await session.signIn(person.email, person.password)).toBe("signin-throttled");
  });
});
