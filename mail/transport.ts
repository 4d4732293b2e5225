import nodemailer, { type Transporter } from "nodemailer";
import { serverEnv } from "@/lib/env";

const cache = globalThis as unknown as { bandgateMailer?: Transporter };

/** SMTP transport from the environment; in dev and tests SMTP_HOST points at the local mail catcher. */
export function mailTransport(): Transporter {
  if (cache.bandgateMailer) return cache.bandgateMailer;
  const env = serverEnv();
  cache.bandgateMailer = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: !env.SMTP_SECURE && (env.SMTP_HOST === "127.0.0.1" || env.SMTP_HOST === "localhost"),
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? "" } : undefined,
  });
  return cache.bandgateMailer;
}
