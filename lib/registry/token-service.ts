import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { generateApiToken } from "./tokens";

/** Creates a read-only token for the signed-in person; the token text is returned this once and never again. */
export async function createApiToken(actor: SessionUser, input: { name: string }): Promise<{ id: string; token: string }> {
  const { token, hash, prefix } = generateApiToken();
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(apiTokens).values({ userId: actor.id, name: input.name, tokenHash: hash, prefix, scope: "read" }).returning({ id: apiTokens.id });
    await recordAudit(tx, { actorId: actor.id, action: "api-token.created", subjectType: "api-token", subjectId: row.id, after: { name: input.name, prefix, scope: "read" } });
    return { id: row.id, token };
  });
}

export async function revokeApiToken(actor: SessionUser, input: { tokenId: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, input.tokenId), eq(apiTokens.userId, actor.id), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id, prefix: apiTokens.prefix });
    if (!row) throw new AppError("not-found:token", "No such active token of yours.");
    await recordAudit(tx, { actorId: actor.id, action: "api-token.revoked", subjectType: "api-token", subjectId: row.id, after: { prefix: row.prefix } });
  });
}

export function listApiTokens(userId: string) {
  return db
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, scope: apiTokens.scope, requestsPerMinute: apiTokens.requestsPerMinute, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt));
}
