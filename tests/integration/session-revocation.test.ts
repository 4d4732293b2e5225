import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { stopJobQueue } from "@/lib/jobs/boss";
import { freshLoopbackAddress } from "../support/bound-fetch";
import { appUrl, HttpSession } from "../support/http-session";
import { linkFromLatestMail, mailTo } from "../support/mailbox";
import { createPerson } from "../support/people";
import { waitFor } from "./registry-world";

afterAll(async () => {
  await stopJobQueue();
  await closeDb();
});

const ACCOUNT_ACTIONS = "app/(workspace)/account/actions.ts";
const RESET_ACTIONS = "app/reset-password/actions.ts";

type ActionResult = { ok: boolean; error?: string };

async function signedIn(person: { email: string; password: string }): Promise<HttpSession> {
  const session = new HttpSession(appUrl());
  expect(await session.signIn(person.email, person.password)).toBeNull();
  return session;
}

/** Whether this cookie still gets through: a route handler (401 otherwise) and a page (sign-in redirect otherwise). */
async function stillSignedIn(session: HttpSession): Promise<boolean> {
  const api = await session.fetch("/api/board");
  const page = await session.fetch("/account");
  expect([200, 401]).toContain(api.status);
  if (api.status === 401) {
    expect([303, 307]).toContain(page.status);
    expect(page.headers.get("location")).toContain("/login?callbackUrl=%2Faccount");
  } else {
    expect(page.status).toBe(200);
  }
  return api.status === 200;
}

// Several sign-ins (bcrypt) per test and a mail through the worker: generous limits for a busy machine.
describe("earlier sessions end", { timeout: 90_000 }, () => {
  it("when the password is changed from another session; the session that changed it goes on", async () => {
    const person = await createPerson(["author"]);
    const before = await signedIn(person);
    const changer = await signedIn(person);
    expect(await stillSignedIn(before)).toBe(true);

    const result = await changer.action<ActionResult>("/account", ACCOUNT_ACTIONS, "changePasswordAction", {
      current: person.password,
      password: "a-fresh-password-1",
      confirm: "a-fresh-password-1",
    });
    expect(result).toMatchObject({ ok: true });

    expect(await stillSignedIn(before)).toBe(false);
    expect(await stillSignedIn(changer)).toBe(true);
    expect(await new HttpSession(appUrl()).signIn(person.email, "a-fresh-password-1")).toBeNull();
  });

  it("when the password is reset by mailed link", async () => {
    const person = await createPerson(["reviewer"]);
    const before = await signedIn(person);

    const stranger = new HttpSession(appUrl(), { localAddress: freshLoopbackAddress() });
    expect(await stranger.action<ActionResult>("/reset-password", RESET_ACTIONS, "requestResetAction", { email: person.email })).toMatchObject({ ok: true });
    await waitFor("the reset mail (sent by the worker)", async () => (await mailTo(person.email)).length > 0);
    const token = new URL(await linkFromLatestMail(person.email, "/reset-password/")).pathname.split("/").pop()!;
    const reset = await stranger.action<ActionResult>(`/reset-password/${token}`, RESET_ACTIONS, "resetPasswordAction", {
      token,
      password: "reset-to-this-one",
      confirm: "reset-to-this-one",
    });
    expect(reset).toMatchObject({ ok: true });

    expect(await stillSignedIn(before)).toBe(false);
    expect(await new HttpSession(appUrl()).signIn(person.email, "reset-to-this-one")).toBeNull();
  });

  it("when the person signs out: a copy of the token taken before stops working too", async () => {
    const person = await createPerson(["author"]);
    const session = await signedIn(person);
    const copied = session.copy();
    const other = await signedIn(person);
    expect(await stillSignedIn(copied)).toBe(true);

    expect(new URL(await session.signOut()).pathname).toBe("/login");

    expect(await stillSignedIn(copied)).toBe(false);
    expect(await stillSignedIn(other)).toBe(false);
    expect(await stillSignedIn(await signedIn(person))).toBe(true);
  });

  it("when an admin changes the person's roles; an admin changing their own roles stays signed in", async () => {
    const admin = await createPerson(["admin"]);
    const person = await createPerson(["author"]);
    const adminSession = await signedIn(admin);
    const before = await signedIn(person);

    const changed = await adminSession.json(`/api/admin/users/${person.id}`, "PATCH", { roles: ["author", "reviewer"], version: 1 });
    expect(changed.status).toBe(200);
    expect(await stillSignedIn(before)).toBe(false);

    const own = await adminSession.json(`/api/admin/users/${admin.id}`, "PATCH", { roles: ["admin", "author"], version: 1 });
    expect(own.status).toBe(200);
    expect(await stillSignedIn(adminSession)).toBe(true);
  });

  it("when the account is deactivated, and stays ended after it is reactivated", async () => {
    const admin = await createPerson(["admin"]);
    const person = await createPerson(["author"]);
    const adminSession = await signedIn(admin);
    const before = await signedIn(person);

    expect((await adminSession.json(`/api/admin/users/${person.id}`, "PATCH", { active: false, version: 1 })).status).toBe(200);
    expect((await adminSession.json(`/api/admin/users/${person.id}`, "PATCH", { active: true, version: 2 })).status).toBe(200);
    expect(await stillSignedIn(before)).toBe(false);
  });
});
