import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";

export function canAdminister(user: Pick<SessionUser, "roles">): boolean {
  return user.roles.includes("admin");
}

export function assertAdmin(user: Pick<SessionUser, "roles">): void {
  if (!canAdminister(user)) throw new AppError("forbidden:admin", "Only an admin may do this.");
}
