import "server-only";
import { and, count, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { apiTokens, users } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import { API_TOKEN_LIMIT, generateApiToken } from "./tokens";

/**
 * Creates a read-only token for the signed-in person; the token text is returned this once and never again. At most
 * API_TOKEN_LIMIT active tokens per person: the person's row is locked while counting, so racing requests cannot
 * pass the cap together.
 */
export async function createApiToken(actor: SessionUser, input: { name: string }): Promise<{ id: string; token: string }> {
  const { token, hash, prefix } = generateApiToken();
  return db.transaction(async (tx) => {
    await tx.select({ id: users.id }).from(users).where(eq(users.id, actor.id)).for("update");
    const [{ active }] = await tx.select({ active: count() }).from(apiTokens).where(and(eq(apiTokens.userId, actor.id), isNull(apiTokens.revokedAt)));
    if (active >= API_TOKEN_LIMIT) {
      throw new AppError("refused:token-limit", `You have ${API_TOKEN_LIMIT} active API tokens, the most one person may hold. Revoke one you no longer use, then create the new one.`);
    }
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
