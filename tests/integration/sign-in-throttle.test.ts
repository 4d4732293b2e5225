import { randomInt, randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_IP } from "@/lib/auth/rate-limit";
import { startApp } from "../support/app-server";
import { freshLoopbackAddress } from "../support/bound-fetch";
import { appUrl, HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";

afterAll(closeDb);

const freshDocumentationAddress = () => `2001:db8::${randomInt(1, 0xffff).toString(16)}:${randomInt(1, 0xffff).toString(16)}`;
const spoofed = () => `203.0.113.${randomInt(1, 255)}`;
const nobody = () => `nobody-${randomUUID().slice(0, 8)}@test.invalid`;

function tally(codes: (string | null)[]) {
  return {
    failed: codes.filter((c) => c === "signin-failed").length,
    throttled: codes.filter((c) => c === "signin-throttled").length,
    other: codes.filter((c) => c !== "signin-failed" && c !== "signin-throttled").length,
  };
}

// Each test runs dozens of bcrypt checks (and one starts a second server): generous limits for a busy machine.
describe("sign-in throttling through the sign-in endpoint", { timeout: 120_000 }, () => {
  it(`checks at most ${MAX_FAILURES_PER_ACCOUNT} of 20 simultaneous wrong passwords for one account, then refuses even the right one`, async () => {
    const person = await createPerson(["author"]);
    const client = new HttpSession(appUrl(), { localAddress: freshLoopbackAddress() });
    await client.fetch("/api/auth/csrf"); // one CSRF cookie for all the attempts below

    const codes = await Promise.all(Array.from({ length: 20 }, () => client.signIn(person.email, "wrong-password")));

    expect(tally(codes)).toEqual({ failed: MAX_FAILURES_PER_ACCOUNT, throttled: 20 - MAX_FAILURES_PER_ACCOUNT, other: 0 });
    // Only checked attempts are recorded: the refused ones never reached the password check.
    expect(await db.select().from(signInAttempts).where(eq(signInAttempts.email, person.email))).toHaveLength(MAX_FAILURES_PER_ACCOUNT);
    expect(await client.signIn(person.email, person.password)).toBe("signin-throttled");
    expect(await new HttpSession(appUrl(), { localAddress: freshLoopbackAddress() }).signIn(person.email, person.password)).toBe("signin-throttled");
  });

  it("counts a client by its own address when it writes X-Forwarded-For itself (no proxy configured)", async () => {
    const address = freshLoopbackAddress();
    const client = new HttpSession(appUrl(), { localAddress: address });
    await client.fetch("/api/auth/csrf");

    const codes = await Promise.all(Array.from({ length: MAX_FAILURES_PER_IP }, () => client.signIn(nobody(), "wrong-password", spoofed())));
    expect(tally(codes)).toEqual({ failed: MAX_FAILURES_PER_IP, throttled: 0, other: 0 });
    expect(await client.signIn(nobody(), "wrong-password", spoofed())).toBe("signin-throttled");

    const person = await createPerson(["author"]);
    expect(await client.signIn(person.email, person.password, `${spoofed()}, ${spoofed()}`)).toBe("signin-throttled");
    expect(await new HttpSession(appUrl(), { localAddress: freshLoopbackAddress() }).signIn(person.email, person.password)).toBeNull();
  });

  it("behind one trusted proxy, counts the address the proxy appended, not the client-written left part", async () => {
    const app = await startApp({ TRUSTED_PROXY_COUNT: "1" });
    try {
      // The test is the proxy here: it connects from 127.0.0.1 and appends the client address it "saw".
      const client = freshDocumentationAddress();
      const viaProxy = new HttpSession(app.base);
      await viaProxy.fetch("/api/auth/csrf");
      const codes = await Promise.all(
        Array.from({ length: MAX_FAILURES_PER_IP }, () => viaProxy.signIn(nobody(), "wrong-password", `${spoofed()}, ${client}`)),
      );
      expect(tally(codes)).toEqual({ failed: MAX_FAILURES_PER_IP, throttled: 0, other: 0 });
      const person = await createPerson(["author"]);
      expect(await viaProxy.signIn(person.email, person.password, `${spoofed()}, ${client}`)).toBe("signin-throttled");
      expect(await viaProxy.signIn(person.email, person.password, `${client}, ${freshDocumentationAddress()}`)).toBeNull();
    } finally {
      await app.stop();
    }
  });
});
