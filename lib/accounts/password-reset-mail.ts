import "server-only";
import { and, count, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { passwordResetTokens, users } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { newSecretToken } from "@/lib/auth/secrets";
import { serverEnv } from "@/lib/env";
import type { PasswordResetMailJob } from "@/lib/jobs/queues";
import { sendMail } from "@/mail/send";
import { passwordResetMail } from "@/mail/templates";

const RESET_MINUTES = 60;
const MAX_RESETS_PER_WINDOW = 3;
/** Reset mails an hour from one address, across all accounts (common practice: a few per person behind one NAT). */
export const MAX_RESETS_PER_IP = 10;

/**
 * Worker side of a reset request (queued by requestPasswordReset): mails a one-hour link to an active account, at most
 * three an hour to one account and MAX_RESETS_PER_IP an hour from one address. Unknown and inactive addresses get
 * nothing. The account row is locked, so two workers cannot both pass the per-account cap.
 */
export async function mailPasswordReset({ email, requestedIp }: PasswordResetMailJob): Promise<void> {
  await db.transaction(async (tx) => {
    const [user] = await tx
      .select({ id: users.id, name: users.name, active: users.active })
      .from(users)
      .where(eq(users.email, email))
      .for("update");
    if (!user || !user.active) return;
    const since = new Date(Date.now() - RESET_MINUTES * 60_000);
    const [{ recent }] = await tx
      .select({ recent: count() })
      .from(passwordResetTokens)
      .where(and(eq(passwordResetTokens.userId, user.id), gt(passwordResetTokens.createdAt, since)));
    // No more mail: stops a stranger from flooding someone's inbox with reset links.
    if (recent >= MAX_RESETS_PER_WINDOW) return;
    if (requestedIp) {
      const [{ fromHere }] = await tx
        .select({ fromHere: count() })
        .from(passwordResetTokens)
        .where(and(eq(passwordResetTokens.requestedIp, requestedIp), gt(passwordResetTokens.createdAt, since)));
      // …and from one address to many accounts (a script walking a list of e-mails).
      if (fromHere >= MAX_RESETS_PER_IP) return;
    }
    await tx
      .update(passwordResetTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResetTokens.userId, user.id), isNull(passwordResetTokens.usedAt)));
    const { token, hash } = newSecretToken();
    const expiresAt = new Date(Date.now() + RESET_MINUTES * 60_000);
    await tx.insert(passwordResetTokens).values({ userId: user.id, tokenHash: hash, expiresAt, requestedIp });
    await recordAudit(tx, { actorId: null, action: "password.reset-requested", subjectType: "user", subjectId: user.id });
    const link = new URL(`/reset-password/${token}`, serverEnv().APP_URL).toString();
    await sendMail(passwordResetMail({ to: email, name: user.name, link, expiresAt }));
  });
}
