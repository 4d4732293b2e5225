import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { passwordResetTokens } from "@/db/schema";
import { stopJobQueue } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { freshLoopbackAddress } from "../support/bound-fetch";
import { appUrl, HttpSession } from "../support/http-session";
import { mailTo } from "../support/mailbox";
import { createPerson } from "../support/people";
import { waitFor } from "./registry-world";

afterAll(async () => {
  await stopJobQueue();
  await closeDb();
});

/** The queued reset jobs for one address, as pg-boss holds them. */
async function resetJobsFor(email: string) {
  const { rows } = await db.execute<{ state: string; data: Record<string, unknown> }>(
    sql`select state, data from pgboss.job where name = ${QUEUES.passwordResetMail} and data->>'email' = ${email}`,
  );
  return rows;
}

/** Asked through the form's server action, with an X-Forwarded-For the client wrote itself (no proxy is trusted). */
async function requestReset(email: string, from = freshLoopbackAddress()) {
  return new HttpSession(appUrl(), { localAddress: from }).action<{ ok: boolean; data?: { email: string } }>(
    "/reset-password",
    "app/reset-password/actions.ts",
    "requestResetAction",
    { email },
    { "x-forwarded-for": "203.0.113.77" },
  );
}

describe("a password-reset request", { timeout: 60_000 }, () => {
  it("does the same work for a known and an unknown address: one queued job each, the same answer", async () => {
    const person = await createPerson(["author"]);
    const unknown = `nobody-${randomUUID().slice(0, 8)}@test.invalid`;

    const from = freshLoopbackAddress();
    const known = await requestReset(person.email, from);
    const stranger = await requestReset(unknown, from);
    expect(known).toMatchObject({ ok: true, data: { email: person.email } });
    expect(stranger).toMatchObject({ ok: true, data: { email: unknown } });
    expect(JSON.stringify(known).replace(person.email, "…")).toBe(JSON.stringify(stranger).replace(unknown, "…"));

    const [knownJobs, unknownJobs] = [await resetJobsFor(person.email), await resetJobsFor(unknown)];
    expect(knownJobs).toHaveLength(1);
    expect(unknownJobs).toHaveLength(1);
    // The same payload: nothing about the account was looked up to build it. The address the per-address cap counts
    // is the connection's, not the one the client wrote.
    expect(knownJobs[0].data).toEqual({ email: person.email, requestedIp: from });
    expect(unknownJobs[0].data).toEqual({ email: unknown, requestedIp: from });
  });

  it("gets its link mailed by the worker to a known address, and nothing to an unknown one", async () => {
    const person = await createPerson(["reviewer"]);
    const unknown = `nobody-${randomUUID().slice(0, 8)}@test.invalid`;
    await requestReset(unknown);
    await requestReset(person.email);

    const [mail] = await waitFor("the reset mail", async () => {
      const found = await mailTo(person.email);
      return found.length > 0 && found;
    });
    expect(mail.subject).toBe("Reset your Bandgate password");
    expect(mail.textBody).toMatch(/\/reset-password\/[A-Za-z0-9_-]{20,}/);
    expect(await db.select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, person.id))).toHaveLength(1);

    await waitFor("the unknown address's job to be done", async () => (await resetJobsFor(unknown))[0]?.state === "completed");
    expect(await mailTo(unknown)).toHaveLength(0);
  });
});
