import type { ReleaseEventKind } from "@/lib/registry/events";
import type { MailMessage } from "./templates";

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] as string);
}

export interface ReleaseEventMailInput {
  to: string;
  name: string;
  kind: ReleaseEventKind;
  familyTitle: string;
  version: string;
  sha256: string;
  reason?: string | null;
  successorVersion?: string | null;
  link: string;
}

const SUBJECT: Record<ReleaseEventKind, (i: ReleaseEventMailInput) => string> = {
  "release.published": (i) => `${i.familyTitle} ${i.version} is released`,
  "release.deprecated": (i) => `${i.familyTitle} ${i.version} is deprecated`,
  "release.withdrawn": (i) => `${i.familyTitle} ${i.version} is withdrawn`,
};

/** Told to people subscribed to a model family when one of its releases is published, deprecated or withdrawn. */
export function releaseEventMail(input: ReleaseEventMailInput): MailMessage {
  const lines = [`Hello ${input.name},`];
  if (input.kind === "release.published") lines.push(`Release ${input.version} of ${input.familyTitle} is published. Its checksum (sha256 of the canonical document) is ${input.sha256}.`);
  if (input.kind === "release.deprecated") {
    lines.push(`Release ${input.version} of ${input.familyTitle} is deprecated${input.reason ? `: ${input.reason}` : "."}`);
    if (input.successorVersion) lines.push(`Its successor is ${input.successorVersion}.`);
  }
  if (input.kind === "release.withdrawn") {
    lines.push(`Release ${input.version} of ${input.familyTitle} is withdrawn${input.reason ? `: ${input.reason}` : "."} It stays readable, flagged as withdrawn; do not start new work from it.`);
  }
  lines.push("You get this message because you follow this family in Bandgate (Settings → Notifications).");
  const body = lines.map((p) => `<p>${escapeHtml(p)}</p>`).join("");
  return {
    to: input.to,
    subject: SUBJECT[input.kind](input),
    text: `${lines.join("\n\n")}\n\n${input.link}\n`,
    html: `<div style="font-family:sans-serif;color:#2b2620;background:#f7f2e8;padding:24px">${body}<p><a href="${escapeHtml(input.link)}" style="color:#a4542a">Open the release</a></p></div>`,
  };
}
