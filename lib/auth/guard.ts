import "server-only";
import { getServerSession } from "next-auth";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { getSessionUser } from "@/lib/accounts/queries";
import { AppError } from "@/lib/errors";
import { authOptions, type SessionClaims } from "./options";
import { hasAnyRole, type Role } from "./roles";
import type { SessionUser } from "./session-user";

/**
 * The one place that answers "who is asking, and may they?". Route handlers and server actions use
 * requireUser/requireRole (coded errors → 401/403); pages use requirePageUser (sign-in redirect or 403 page).
 *
 * The session's account is loaded fresh (one primary-key lookup, once per request: React's cache shares it between the
 * layout and the page of one render). A token whose session version is not the account's current one — from before a
 * password change or reset, a role change, a deactivation or a sign-out — counts as no session.
 */
export const currentUser = cache(async (): Promise<SessionUser | null> => {
  const session = (await getServerSession(authOptions)) as SessionClaims | null;
  if (!session?.uid || session.sv === undefined) return null;
  const row = await getSessionUser(session.uid);
  if (!row || !row.active || row.sessionVersion !== session.sv) return null;
  return { id: row.id, email: row.email, name: row.name, roles: row.roles };
});

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new AppError("unauthenticated:session", "Sign in first.");
  return user;
}

export async function requireRole(...roles: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!hasAnyRole(user.roles, roles)) {
    throw new AppError("forbidden:role", `This needs the ${roles.join(" or ")} role.`);
  }
  return user;
}

export async function requirePageUser(from: string, roles: Role[] = []): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/login?callbackUrl=${encodeURIComponent(from)}`);
  if (roles.length > 0 && !hasAnyRole(user.roles, roles)) forbidden();
  return user;
}
