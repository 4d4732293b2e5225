import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/secrets";
import type { Role } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";

export const TEST_PASSWORD = "correct-horse-battery";

/** A fresh account with a unique address, so tests never depend on each other's data. */
export async function createPerson(roles: Role[], label = roles.join("-") || "nobody"): Promise<SessionUser & { password: string }> {
  const email = `${label}-${randomUUID().slice(0, 8)}@test.invalid`;
  const [row] = await db
    .insert(users)
    .values({ email, name: `Test ${label}`, roles, passwordHash: await hashPassword(TEST_PASSWORD) })
    .returning({ id: users.id });
  return { id: row.id, email, name: `Test ${label}`, roles, password: TEST_PASSWORD };
}
