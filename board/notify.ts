import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { familyCurators, modelFamilies, proposals, reviewerAssignments, users } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { sendMail } from "@/mail/send";
import type { MailMessage } from "@/mail/templates";
import { decisionMail, mentionMail, revisionSubmittedMail, reviewerAssignedMail, verdictGivenMail } from "@/mail/templates-review";
import { mayReadRemarks } from "./remark-rules";
import { VERDICT_LABEL, type Stage, type Verdict } from "./stages";

/**
 * E-mail after a workflow change has been committed. Best effort: a mail failure is logged and never undoes the
 * change (the change is already in the audit trail and on the board).
 */
export const notifications = { enabled: true };

async function deliver(messages: MailMessage[]): Promise<void> {
  if (!notifications.enabled) return;
  for (const m of messages) {
    try {
      await sendMail(m);
    } catch (err) {
      console.error("[bandgate] notification not delivered", m.subject, err instanceof Error ? err.message : err);
    }
  }
}

const link = (proposalId: string) => new URL(`/proposals/${proposalId}/review`, serverEnv().APP_URL).toString();

async function proposalInfo(proposalId: string) {
  const [row] = await db
    .select({ title: proposals.title, authorId: proposals.authorId, familyId: proposals.familyId, family: modelFamilies.title, authorEmail: users.email, authorName: users.name })
    .from(proposals)
    .innerJoin(modelFamilies, eq(modelFamilies.id, proposals.familyId))
    .innerJoin(users, eq(users.id, proposals.authorId))
    .where(eq(proposals.id, proposalId));
  return row;
}

async function emailsOf(ids: string[]) {
  if (ids.length === 0) return [];
  return db.select({ id: users.id, email: users.email, name: users.name, active: users.active }).from(users).where(inArray(users.id, ids));
}

export async function notifyReviewerAssigned(proposalId: string, reviewerId: string, curatorName: string): Promise<void> {
  const p = await proposalInfo(proposalId);
  const [reviewer] = await emailsOf([reviewerId]);
  if (p && reviewer?.active) await deliver([reviewerAssignedMail(reviewer.email, { title: p.title, family: p.family, curator: curatorName, link: link(proposalId) })]);
}

export async function notifyVerdict(proposalId: string, reviewerName: string, verdict: Verdict): Promise<void> {
  const p = await proposalInfo(proposalId);
  if (!p) return;
  const curators = await db.select({ id: familyCurators.userId }).from(familyCurators).where(eq(familyCurators.familyId, p.familyId));
  const people = (await emailsOf([p.authorId, ...curators.map((c) => c.id)])).filter((u) => u.active);
  await deliver(people.map((u) => verdictGivenMail(u.email, { title: p.title, reviewer: reviewerName, verdict: VERDICT_LABEL[verdict], link: link(proposalId) })));
}

/** After a move: new revision back under review → reviewers; accepted/declined → the author. */
export async function notifyMove(proposalId: string, from: Stage, to: Stage, revision: number, reason?: string | null): Promise<void> {
  const p = await proposalInfo(proposalId);
  if (!p) return;
  if (from === "revision" && to === "under_review") {
    const assigned = await db.select({ id: reviewerAssignments.reviewerId }).from(reviewerAssignments).where(eq(reviewerAssignments.proposalId, proposalId));
    const people = (await emailsOf(assigned.map((a) => a.id))).filter((u) => u.active);
    await deliver(people.map((u) => revisionSubmittedMail(u.email, { title: p.title, author: p.authorName, revision, link: link(proposalId) })));
  }
  if (to === "accepted" || to === "declined") {
    await deliver([decisionMail(p.authorEmail, { title: p.title, decision: to, reason, link: link(proposalId) })]);
  }
}

/** Only people who may read the proposal hear of a mention: the mail carries the remark's text. */
export async function notifyMentions(proposalId: string, handles: string[], writer: { id: string; name: string }, body: string): Promise<void> {
  if (handles.length === 0) return;
  const p = await proposalInfo(proposalId);
  const all = await db.select({ email: users.email, roles: users.roles, id: users.id }).from(users).where(eq(users.active, true));
  const targets = all.filter((u) => handles.includes(u.email.split("@")[0].toLowerCase()) && u.id !== writer.id && mayReadRemarks(u));
  const excerpt = body.length > 400 ? `${body.slice(0, 400)}…` : body;
  await deliver(targets.map((u) => mentionMail(u.email, { title: p?.title ?? "a proposal", writer: writer.name, excerpt, link: link(proposalId) })));
}
