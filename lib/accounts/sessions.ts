import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";

/**
 * Ends every session of the account that a token of `version` belongs to (sign-out). A token that is already out of
 * date changes nothing, so a stale copy cannot keep signing its owner out.
 */
export async function endSessionsOf(userId: string, version: number): Promise<void> {
  await db
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(and(eq(users.id, userId), eq(users.sessionVersion, version)));
}
