import "server-only";
import { getServerSession } from "next-auth";
import { forbidden, redirect } from "next/navigation";
import { getUserById } from "@/lib/accounts/queries";
import { db } from "@/db/client";
import { AppError } from "@/lib/errors";
import { authOptions } from "./options";
import { hasAnyRole, type Role } from "./roles";
import type { SessionUser } from "./session-user";

/**
 * The one place that answers "who is asking, and may they?". Route handlers and server actions use
 * requireUser/requireRole (coded errors → 401/403); pages use requirePageUser (sign-in redirect or 403 page).
 */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  const uid = (session as { uid?: string } | null)?.uid;
  if (!uid) return null;
  const row = await getUserById(db, uid);
  if (!row || !row.active) return null;
  return { id: row.id, email: row.email, name: row.name, roles: row.roles };
}

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
