import type PgBoss from "pg-boss";
import { mailPasswordReset } from "@/lib/accounts/password-reset-mail";
import { QUEUES, type PasswordResetMailJob } from "./queues";

/** How many queued reset requests one poll takes (pg-boss waits a poll interval between fetches). */
export const RESET_MAIL_BATCH = 10;

/**
 * Handles a batch of reset requests one at a time, oldest first (the caps count the links sent before; a fetched
 * batch comes in no particular order). A request whose mail fails is handed back on its own for a retry; pg-boss then
 * completes the others.
 */
export async function sendPasswordResetMails(boss: PgBoss, jobs: PgBoss.JobWithMetadata<PasswordResetMailJob>[]): Promise<void> {
  const oldestFirst = [...jobs].sort((a, b) => a.createdOn.getTime() - b.createdOn.getTime());
  for (const job of oldestFirst) {
    try {
      await mailPasswordReset(job.data);
    } catch (err) {
      await boss.fail(QUEUES.passwordResetMail, job.id, { message: err instanceof Error ? err.message : String(err) });
    }
  }
}
