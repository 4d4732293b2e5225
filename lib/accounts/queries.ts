import "server-only";
import { and, desc, eq, gt, isNull } from "drizzle-orm";
import { db, type Database, type Tx } from "@/db/client";
import { auditEvents, caughtMail, invitations, passwordResetTokens, signInAttempts, users } from "@/db/schema";

type Conn = Database | Tx;

export const publicUserColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  roles: users.roles,
  active: users.active,
  version: users.version,
  createdAt: users.createdAt,
};

export function listUsers() {
  return db.select(publicUserColumns).from(users).orderBy(users.name);
}

export async function getUserById(conn: Conn, id: string) {
  const [row] = await conn.select(publicUserColumns).from(users).where(eq(users.id, id));
  return row ?? null;
}

/** Who a session belongs to, with the session version its token must carry (one primary-key lookup). */
export async function getSessionUser(id: string) {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name, roles: users.roles, active: users.active, sessionVersion: users.sessionVersion })
    .from(users)
    .where(eq(users.id, id));
  return row ?? null;
}

export async function getCredentialsByEmail(email: string) {
  const [row] = await db
    .select({ id: users.id, passwordHash: users.passwordHash, active: users.active, sessionVersion: users.sessionVersion })
    .from(users)
    .where(eq(users.email, email));
  return row ?? null;
}

export async function getPasswordHash(conn: Conn, id: string) {
  const [row] = await conn.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, id));
  return row?.passwordHash ?? null;
}

export async function emailTaken(conn: Conn, email: string): Promise<boolean> {
  const [row] = await conn.select({ id: users.id }).from(users).where(eq(users.email, email));
  return Boolean(row);
}

export async function findInvitationByHash(conn: Conn, tokenHash: string) {
  const [row] = await conn.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for("update");
  return row ?? null;
}

export function listOpenInvitations() {
  return db
    .select({ id: invitations.id, email: invitations.email, name: invitations.name, roles: invitations.roles, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(desc(invitations.createdAt));
}

export async function findResetTokenByHash(conn: Conn, tokenHash: string) {
  const [row] = await conn.select().from(passwordResetTokens).where(eq(passwordResetTokens.tokenHash, tokenHash)).for("update");
  return row ?? null;
}

export async function recordSignInAttempt(email: string, ip: string, succeeded: boolean): Promise<void> {
  await db.insert(signInAttempts).values({ email, ip, succeeded });
}

export function listAuditEvents(limit: number) {
  return db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      subjectType: auditEvents.subjectType,
      subjectId: auditEvents.subjectId,
      before: auditEvents.before,
      after: auditEvents.after,
      createdAt: auditEvents.createdAt,
      actorName: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .orderBy(desc(auditEvents.id))
    .limit(limit);
}

export function listCaughtMail(limit: number) {
  return db
    .select({ id: caughtMail.id, sender: caughtMail.sender, recipients: caughtMail.recipients, subject: caughtMail.subject, receivedAt: caughtMail.receivedAt })
    .from(caughtMail)
    .orderBy(desc(caughtMail.id))
    .limit(limit);
}

export async function getCaughtMail(id: number) {
  const [row] = await db.select().from(caughtMail).where(eq(caughtMail.id, id));
  return row ?? null;
}
