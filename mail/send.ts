import { AppError } from "@/lib/errors";
import { serverEnv } from "@/lib/env";
import type { MailMessage } from "./templates";
import { mailTransport } from "./transport";

/** Send one message; a delivery failure becomes a coded error so the caller's transaction rolls back. */
export async function sendMail(message: MailMessage): Promise<void> {
  try {
    await mailTransport().sendMail({ from: serverEnv().MAIL_FROM, ...message });
  } catch (err) {
    console.error("[bandgate] mail delivery failed", err instanceof Error ? err.message : err);
    throw new AppError("conflict:mail", "The e-mail could not be sent, so nothing was changed. Try again later.");
  }
}
