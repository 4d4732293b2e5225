import type { Role } from "@/lib/auth/roles";

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] as string);
}

export function mailLayout(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join("");
  return `<div style="font-family:sans-serif;color:#2b2620;background:#f7f2e8;padding:24px">${body}<p><a href="${escapeHtml(link.href)}" style="color:#a4542a">${escapeHtml(link.label)}</a></p><p style="color:#6b6257;font-size:12px">Bandgate — review and release of tight-binding models</p></div>`;
}

export function invitationMail(input: { to: string; name: string; inviterName: string; roles: Role[]; link: string; expiresAt: Date }): MailMessage {
  const lines = [
    `Hello ${input.name},`,
    `${input.inviterName} invited you to Bandgate as ${input.roles.join(", ")}.`,
    `Choose a password to finish joining. The link works once and until ${input.expiresAt.toUTCString()}.`,
  ];
  return {
    to: input.to,
    subject: "You are invited to Bandgate",
    text: `${lines.join("\n\n")}\n\n${input.link}\n`,
    html: mailLayout(lines, { href: input.link, label: "Set your password" }),
  };
}

export function passwordResetMail(input: { to: string; name: string; link: string; expiresAt: Date }): MailMessage {
  const lines = [
    `Hello ${input.name},`,
    "Someone asked to reset the password of your Bandgate account. If it was not you, ignore this message.",
    `The link works once and until ${input.expiresAt.toUTCString()}.`,
  ];
  return {
    to: input.to,
    subject: "Reset your Bandgate password",
    text: `${lines.join("\n\n")}\n\n${input.link}\n`,
    html: mailLayout(lines, { href: input.link, label: "Choose a new password" }),
  };
}
