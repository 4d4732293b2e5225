import { mailLayout, type MailMessage } from "./templates";

/** Workflow notices of the review board; each links to the proposal. */
function notice(to: string, subject: string, lines: string[], link: string): MailMessage {
  return { to, subject, text: `${lines.join("\n\n")}\n\n${link}\n`, html: mailLayout(lines, { href: link, label: "Open the proposal" }) };
}

export function reviewerAssignedMail(to: string, p: { title: string; family: string; curator: string; link: string }): MailMessage {
  return notice(to, `Review requested: ${p.title}`, [`${p.curator} asked you to review “${p.title}” (${p.family}).`, "Read the parameter diff and the band comparison, then give your verdict."], p.link);
}

export function verdictGivenMail(to: string, p: { title: string; reviewer: string; verdict: string; link: string }): MailMessage {
  return notice(to, `Verdict on ${p.title}: ${p.verdict}`, [`${p.reviewer} gave the verdict “${p.verdict}” on “${p.title}”.`], p.link);
}

export function revisionSubmittedMail(to: string, p: { title: string; author: string; revision: number; link: string }): MailMessage {
  return notice(
    to,
    `New revision to review: ${p.title}`,
    [`${p.author} submitted revision ${p.revision} of “${p.title}” for review.`, "Verdicts on earlier physics are marked stale; please look again."],
    p.link,
  );
}

export function decisionMail(to: string, p: { title: string; decision: "accepted" | "declined"; reason?: string | null; link: string }): MailMessage {
  const lines = [`“${p.title}” was ${p.decision}.`];
  if (p.reason) lines.push(`Reason: ${p.reason}`);
  return notice(to, `Proposal ${p.decision}: ${p.title}`, lines, p.link);
}

export function mentionMail(to: string, p: { title: string; writer: string; excerpt: string; link: string }): MailMessage {
  return notice(to, `${p.writer} mentioned you on ${p.title}`, [`${p.writer} mentioned you in a remark on “${p.title}”:`, p.excerpt], p.link);
}

export function fitFinishedMail(to: string, p: { title: string; outcome: string; details: string[]; link: string }): MailMessage {
  return {
    to,
    subject: `Refit ${p.outcome}: ${p.title}`,
    text: `Your refit of “${p.title}” ${p.outcome}.\n\n${p.details.join("\n\n")}\n\n${p.link}\n`,
    html: mailLayout([`Your refit of “${p.title}” ${p.outcome}.`, ...p.details], { href: p.link, label: "Open the fit record" }),
  };
}
