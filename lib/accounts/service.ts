import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitations, passwordResetTokens, users } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { UNKNOWN_IP } from "@/lib/auth/client-ip";
import { enqueuePasswordResetMail } from "@/lib/jobs/boss";
import { hashPassword, hashToken, newSecretToken, verifyPassword } from "@/lib/auth/secrets";
import { normaliseRoles } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { sendMail } from "@/mail/send";
import { invitationMail } from "@/mail/templates";
import { assertAdmin } from "./policy";
import { emailTaken, findInvitationByHash, findResetTokenByHash, getPasswordHash, getUserById } from "./queries";
import type { AcceptInvitationInput, ChangePasswordInput, ChangeRolesInput, InviteInput, ResetPasswordInput, SetActiveInput } from "./schemas";

const INVITATION_DAYS = 7;
/** Set on every change that must end earlier sessions: their tokens carry the old number (lib/auth/guard.ts). */
const NEXT_SESSION_VERSION = sql<number>`${users.sessionVersion} + 1`;

function appLink(path: string): string {
  return new URL(path, serverEnv().APP_URL).toString();
}

export async function inviteUser(actor: SessionUser, input: InviteInput): Promise<{ invitationId: string }> {
  assertAdmin(actor);
  const roles = normaliseRoles(input.roles);
  return db.transaction(async (tx) => {
    if (await emailTaken(tx, input.email)) {
      throw new AppError("conflict:email", "Someone with that e-mail address already has an account.", { email: ["Already has an account."] });
    }
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const { token, hash } = newSecretToken();
    const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
    const [row] = await tx
      .insert(invitations)
      .values({ email: input.email, name: input.name, roles, tokenHash: hash, invitedBy: actor.id, expiresAt })
      .returning({ id: invitations.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "invitation.created",
      subjectType: "invitation",
      subjectId: row.id,
      after: { email: input.email, name: input.name, roles },
    });
    await sendMail(invitationMail({ to: input.email, name: input.name, inviterName: actor.name, roles, link: appLink(`/join/${token}`), expiresAt }));
    return { invitationId: row.id };
  });
}

function assertUsable(row: { expiresAt: Date; revokedAt?: Date | null } | null, usedAt: Date | null | undefined, what: string): void {
  if (!row) throw new AppError("not-found:token", `This ${what} link is not valid. Ask for a new one.`);
  if (usedAt) throw new AppError("gone:token", `This ${what} link has already been used. Ask for a new one.`);
  if (row.revokedAt) throw new AppError("gone:token", `This ${what} link was replaced by a newer one.`);
  if (row.expiresAt.getTime() < Date.now()) throw new AppError("gone:token", `This ${what} link has expired. Ask for a new one.`);
}

/** Read-only look at an invitation for the join page; never reveals anything for a bad token. */
export async function describeInvitation(token: string): Promise<{ email: string; name: string; roles: string[] }> {
  const row = await findInvitationByHash(db, hashToken(token));
  assertUsable(row, row?.acceptedAt, "invitation");
  return { email: row!.email, name: row!.name, roles: row!.roles };
}

export async function acceptInvitation(input: AcceptInvitationInput): Promise<{ userId: string; email: string }> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const invite = await findInvitationByHash(tx, hashToken(input.token));
    assertUsable(invite, invite?.acceptedAt, "invitation");
    if (await emailTaken(tx, invite!.email)) throw new AppError("conflict:email", "An account with this e-mail address already exists.");
    const [user] = await tx
      .insert(users)
      .values({ email: invite!.email, name: invite!.name, roles: invite!.roles, passwordHash })
      .returning({ id: users.id });
    await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, invite!.id));
    await recordAudit(tx, {
      actorId: user.id,
      action: "invitation.accepted",
      subjectType: "user",
      subjectId: user.id,
      after: { email: invite!.email, roles: invite!.roles },
    });
    return { userId: user.id, email: invite!.email };
  });
}

async function lockUserForChange(tx: Parameters<Parameters<typeof db.transaction>[0]>[0], userId: string, version: number) {
  const [row] = await tx
    .select({ id: users.id, roles: users.roles, active: users.active, version: users.version, email: users.email })
    .from(users)
    .where(eq(users.id, userId))
    .for("update");
  if (!row) throw new AppError("not-found:user", "That person does not exist.");
  if (row.version !== version) {
    throw new AppError("conflict:stale", "Someone changed this person while you were editing. Reload to see the current state.");
  }
  return row;
}

/** Ends the person's earlier sessions; returns their new session version (to renew the actor's own session). */
export async function changeRoles(actor: SessionUser, input: ChangeRolesInput): Promise<{ sessionVersion: number }> {
  assertAdmin(actor);
  const roles = normaliseRoles(input.roles);
  if (input.userId === actor.id && !roles.includes("admin")) {
    throw new AppError("invalid:self-lockout", "You cannot remove your own admin role; ask another admin.");
  }
  return db.transaction(async (tx) => {
    const row = await lockUserForChange(tx, input.userId, input.version);
    const [changed] = await tx
      .update(users)
      .set({ roles, version: row.version + 1, sessionVersion: NEXT_SESSION_VERSION, updatedAt: new Date() })
      .where(eq(users.id, row.id))
      .returning({ sessionVersion: users.sessionVersion });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "user.roles-changed",
      subjectType: "user",
      subjectId: row.id,
      before: { roles: row.roles },
      after: { roles },
    });
    return changed;
  });
}

export async function setActive(actor: SessionUser, input: SetActiveInput): Promise<void> {
  assertAdmin(actor);
  if (input.userId === actor.id && !input.active) {
    throw new AppError("invalid:self-lockout", "You cannot deactivate your own account.");
  }
  await db.transaction(async (tx) => {
    const row = await lockUserForChange(tx, input.userId, input.version);
    await tx
      .update(users)
      .set({ active: input.active, version: row.version + 1, sessionVersion: NEXT_SESSION_VERSION, updatedAt: new Date() })
      .where(eq(users.id, row.id));
    await recordAudit(tx, {
      actorId: actor.id,
      action: input.active ? "user.reactivated" : "user.deactivated",
      subjectType: "user",
      subjectId: row.id,
      before: { active: row.active },
      after: { active: input.active },
    });
  });
}

/**
 * The request only validates (the caller's schema), records and enqueues: the same statements for every address, so
 * neither the answer nor its timing says which addresses have accounts. The worker looks the account up, applies the
 * caps and mails the link (mailPasswordReset). `ip` is the client address from clientIp.
 */
export async function requestPasswordReset(email: string, ip: string): Promise<void> {
  await enqueuePasswordResetMail({ email, requestedIp: ip === UNKNOWN_IP ? null : ip });
}

export async function resetPassword(input: ResetPasswordInput): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await db.transaction(async (tx) => {
    const row = await findResetTokenByHash(tx, hashToken(input.token));
    assertUsable(row, row?.usedAt, "password reset");
    const user = await getUserById(tx, row!.userId);
    if (!user || !user.active) throw new AppError("forbidden:inactive", "This account is deactivated.");
    await tx.update(users).set({ passwordHash, sessionVersion: NEXT_SESSION_VERSION, updatedAt: new Date() }).where(eq(users.id, user.id));
    await tx.update(passwordResetTokens).set({ usedAt: new Date() }).where(eq(passwordResetTokens.id, row!.id));
    await recordAudit(tx, { actorId: user.id, action: "password.reset", subjectType: "user", subjectId: user.id });
  });
}

/** Ends every session of the actor, this one included; returns the new session version to renew this one with. */
export async function changeOwnPassword(actor: SessionUser, input: ChangePasswordInput): Promise<{ sessionVersion: number }> {
  const current = await getPasswordHash(db, actor.id);
  if (!current || !(await verifyPassword(input.current, current))) {
    throw new AppError("invalid:password", "Your current password is not right.", { current: ["Not right."] });
  }
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [changed] = await tx
      .update(users)
      .set({ passwordHash, sessionVersion: NEXT_SESSION_VERSION, updatedAt: new Date() })
      .where(eq(users.id, actor.id))
      .returning({ sessionVersion: users.sessionVersion });
    await recordAudit(tx, { actorId: actor.id, action: "password.changed", subjectType: "user", subjectId: actor.id });
    return changed;
  });
}
