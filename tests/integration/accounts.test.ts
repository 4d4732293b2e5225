import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { auditEvents, invitations, users } from "@/db/schema";
import { MAX_RESETS_PER_IP } from "@/lib/accounts/password-reset-mail";
import { acceptInvitation, changeRoles, describeInvitation, inviteUser, requestPasswordReset, resetPassword, setActive } from "@/lib/accounts/service";
import { authenticate } from "@/lib/auth/authenticate";
import { hashToken } from "@/lib/auth/secrets";
import { AppError } from "@/lib/errors";
import { stopJobQueue } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { createPerson, TEST_PASSWORD } from "../support/people";
import { linkFromLatestMail, mailTo } from "../support/mailbox";
import { waitFor } from "./registry-world";

afterAll(async () => {
  await stopJobQueue();
  await closeDb();
});

/** Reset requests are mailed by the worker: waits until it has handled every request queued for these addresses. */
async function resetJobsDone(...emails: string[]): Promise<void> {
  await waitFor("the worker to handle the reset requests", async () => {
    const { rows } = await db.execute<{ pending: number }>(
      sql`select count(*)::int as pending from pgboss.job where name = ${QUEUES.passwordResetMail} and data->>'email' in ${emails} and state <> 'completed'`,
    );
    return rows[0].pending === 0;
  });
}

const freshEmail = () => `invitee-${randomUUID().slice(0, 8)}@test.invalid`;
const tokenOf = (link: string) => new URL(link).pathname.split("/").pop()!;

async function auditFor(subjectId: string) {
  return db.select().from(auditEvents).where(eq(auditEvents.subjectId, subjectId)).orderBy(auditEvents.id);
}

async function expectCode(promise: Promise<unknown>, code: string) {
  await expect(promise).rejects.toSatisfy((e: unknown) => e instanceof AppError && e.code === code);
}

describe("invitations", () => {
  it("refuses a non-admin and changes nothing", async () => {
    const reviewer = await createPerson(["reviewer", "curator"]);
    const email = freshEmail();
    await expectCode(inviteUser(reviewer, { email, name: "X", roles: ["author"] }), "forbidden:admin");
    expect(await db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(0);
    expect(await mailTo(email)).toHaveLength(0);
  });

  it("mails a one-time link, stores only its hash, and audits; the invitee joins with the roles given", async () => {
    const admin = await createPerson(["admin"]);
    const email = freshEmail();
    const { invitationId } = await inviteUser(admin, { email, name: "New Colleague", roles: ["reviewer", "author"] });
    const link = await linkFromLatestMail(email, "/join/");
    const token = tokenOf(link);
    const [row] = await db.select().from(invitations).where(eq(invitations.id, invitationId));
    expect(row.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    expect((await auditFor(invitationId)).map((e) => e.action)).toEqual(["invitation.created"]);

    expect(await describeInvitation(token)).toMatchObject({ email, roles: ["author", "reviewer"] });
    const { userId } = await acceptInvitation({ token, password: "a-long-password", confirm: "a-long-password" });
    const [user] = await db.select({ roles: users.roles, email: users.email }).from(users).where(eq(users.id, userId));
    expect(user).toEqual({ email, roles: ["author", "reviewer"] });
    expect((await auditFor(userId)).map((e) => e.action)).toContain("invitation.accepted");
    expect(await authenticate({ email, password: "a-long-password" }, "203.0.113.1")).toMatchObject({ id: userId });

    await expectCode(acceptInvitation({ token, password: "another-password", confirm: "another-password" }), "gone:token");
  });

  it("refuses an expired invitation and an unknown token", async () => {
    const admin = await createPerson(["admin"]);
    const email = freshEmail();
    const { invitationId } = await inviteUser(admin, { email, name: "Late", roles: ["consumer"] });
    const token = tokenOf(await linkFromLatestMail(email, "/join/"));
    await db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, invitationId));
    await expectCode(acceptInvitation({ token, password: "a-long-password", confirm: "a-long-password" }), "gone:token");
    await expectCode(describeInvitation("x".repeat(43)), "not-found:token");
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });

  it("refuses to invite an address that already has an account", async () => {
    const admin = await createPerson(["admin"]);
    const existing = await createPerson(["author"]);
    await expectCode(inviteUser(admin, { email: existing.email, name: "Again", roles: ["author"] }), "conflict:email");
  });
});

describe("roles and access", () => {
  it("changes roles with an audit record of before and after, and refuses a stale version", async () => {
    const admin = await createPerson(["admin"]);
    const person = await createPerson(["author"]);
    await changeRoles(admin, { userId: person.id, roles: ["author", "reviewer"], version: 1 });
    const [row] = await db.select({ roles: users.roles, version: users.version }).from(users).where(eq(users.id, person.id));
    expect(row).toEqual({ roles: ["author", "reviewer"], version: 2 });
    const [event] = (await auditFor(person.id)).filter((e) => e.action === "user.roles-changed");
    expect(event).toMatchObject({ actorId: admin.id, before: { roles: ["author"] }, after: { roles: ["author", "reviewer"] } });

    await expectCode(changeRoles(admin, { userId: person.id, roles: ["consumer"], version: 1 }), "conflict:stale");
    const [after] = await db.select({ roles: users.roles }).from(users).where(eq(users.id, person.id));
    expect(after.roles).toEqual(["author", "reviewer"]);
  });

  it("refuses role changes and deactivation from non-admins and admin self-lockout", async () => {
    const admin = await createPerson(["admin"]);
    const curator = await createPerson(["curator"]);
    await expectCode(changeRoles(curator, { userId: curator.id, roles: ["admin"], version: 1 }), "forbidden:admin");
    await expectCode(setActive(curator, { userId: admin.id, active: false, version: 1 }), "forbidden:admin");
    await expectCode(changeRoles(admin, { userId: admin.id, roles: ["author"], version: 1 }), "invalid:self-lockout");
    await expectCode(setActive(admin, { userId: admin.id, active: false, version: 1 }), "invalid:self-lockout");
  });

  it("a deactivated account cannot sign in", async () => {
    const admin = await createPerson(["admin"]);
    const person = await createPerson(["consumer"]);
    await setActive(admin, { userId: person.id, active: false, version: 1 });
    await expectCode(authenticate({ email: person.email, password: TEST_PASSWORD }, "203.0.113.2"), "invalid:credentials");
    expect((await auditFor(person.id)).map((e) => e.action)).toContain("user.deactivated");
  });
});

describe("password reset", () => {
  it("says nothing about unknown addresses and sends no mail", async () => {
    const email = freshEmail();
    await requestPasswordReset(email, "198.51.100.20");
    await resetJobsDone(email);
    expect(await mailTo(email)).toHaveLength(0);
  });

  it("resets once by mailed link; the link cannot be reused", async () => {
    const person = await createPerson(["author"]);
    await requestPasswordReset(person.email, "198.51.100.21");
    await resetJobsDone(person.email);
    const token = tokenOf(await linkFromLatestMail(person.email, "/reset-password/"));
    await resetPassword({ token, password: "brand-new-password", confirm: "brand-new-password" });
    expect(await authenticate({ email: person.email, password: "brand-new-password" }, "203.0.113.3")).toMatchObject({ id: person.id });
    await expectCode(resetPassword({ token, password: "yet-another-one", confirm: "yet-another-one" }), "gone:token");
    expect((await auditFor(person.id)).map((e) => e.action)).toEqual(expect.arrayContaining(["password.reset-requested", "password.reset"]));
  });
});

describe("password reset flooding", () => {
  it("sends at most three reset links an hour to one account, answering the same way every time", async () => {
    const person = await createPerson(["author"]);
    for (let i = 0; i < 5; i++) await requestPasswordReset(person.email, `198.51.100.${30 + i}`);
    await resetJobsDone(person.email);
    const resets = (await mailTo(person.email)).filter((m) => m.subject === "Reset your Bandgate password");
    expect(resets).toHaveLength(3);
  });

  it(`sends at most ${MAX_RESETS_PER_IP} reset links an hour from one address across accounts; other addresses are not held back`, async () => {
    const ip = `2001:db8::${randomUUID().slice(0, 4)}`; // of this run alone: an earlier run's links count for an hour
    const people = [];
    for (let i = 0; i <= MAX_RESETS_PER_IP; i++) people.push(await createPerson(["consumer"], `walk${i}`));
    for (const p of people) await requestPasswordReset(p.email, ip);
    await resetJobsDone(...people.map((p) => p.email));
    const mailed = await Promise.all(people.map(async (p) => (await mailTo(p.email)).length));
    expect(mailed.slice(0, MAX_RESETS_PER_IP)).toEqual(Array(MAX_RESETS_PER_IP).fill(1));
    expect(mailed[MAX_RESETS_PER_IP]).toBe(0);
    await requestPasswordReset(people[MAX_RESETS_PER_IP].email, "203.0.113.250");
    await resetJobsDone(people[MAX_RESETS_PER_IP].email);
    expect(await mailTo(people[MAX_RESETS_PER_IP].email)).toHaveLength(1);
  }, 90_000); // eleven accounts and twelve queued requests: generous under a busy machine
});

describe("sign-in throttling", () => {
  it("locks an account after repeated failures, even for the right password, with its own code", async () => {
    const person = await createPerson(["reviewer"]);
    for (let i = 0; i < 5; i++) {
      await expectCode(authenticate({ email: person.email, password: "wrong-password" }, `203.0.113.${10 + i}`), "invalid:credentials");
    }
    await expectCode(authenticate({ email: person.email, password: TEST_PASSWORD }, "203.0.113.99"), "rate-limited:sign-in");
  });
});

describe("audit trail", () => {
  it("refuses UPDATE, DELETE and TRUNCATE at the database, whoever connects", async () => {
    const admin = await createPerson(["admin"]);
    const person = await createPerson(["author"]);
    await changeRoles(admin, { userId: person.id, roles: ["reviewer"], version: 1 });
    const [event] = await auditFor(person.id);
    // The trigger refuses, or (for the app role, which may only insert and read) the missing privilege does.
    const refused = (e: unknown) => /append-only|permission denied/.test(String((e as { cause?: Error }).cause?.message));
    await expect(db.execute(sql`update audit_events set action = 'tampered' where id = ${event.id}`)).rejects.toSatisfy(refused);
    await expect(db.execute(sql`delete from audit_events where id = ${event.id}`)).rejects.toSatisfy(refused);
    await expect(db.execute(sql`truncate audit_events`)).rejects.toSatisfy(refused);
    const [still] = await db.select().from(auditEvents).where(and(eq(auditEvents.id, event.id), eq(auditEvents.action, event.action)));
    expect(still).toBeDefined();
  });
});
