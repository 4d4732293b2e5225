import { BOARD_ROLES } from "@/lib/auth/navigation";
import type { Role } from "@/lib/auth/roles";
import { z } from "zod";
import { CLOSED_STAGES, type Stage } from "./stages";

/**
 * Remarks: who may write, flag, address, resolve and edit. Pure, so the server and the UI share it; the server decides.
 */
export const REMARK_MAX = 10_000;

export const remarkAnchorSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("proposal") }),
  z.strictObject({ kind: z.literal("parameter"), key: z.string().min(1).max(200) }),
  z.strictObject({ kind: z.literal("k-range"), from: z.string().min(1).max(40), to: z.string().min(1).max(40) }),
]);
export type RemarkAnchor = z.infer<typeof remarkAnchorSchema>;

/** `?remark=param:<key>` or `?remark=k:<from>-<to>` from the diff table and the band plot. */
export function anchorFromQuery(value: string | undefined): RemarkAnchor {
  if (value?.startsWith("param:")) return { kind: "parameter", key: value.slice(6) };
  const k = value?.match(/^k:(.+?)-(.+)$/);
  if (k) return { kind: "k-range", from: k[1], to: k[2] };
  return { kind: "proposal" };
}

export function describeAnchor(anchor: RemarkAnchor): string {
  if (anchor.kind === "parameter") return `parameter ${anchor.key}`;
  if (anchor.kind === "k-range") return `bands from ${anchor.from} to ${anchor.to}`;
  return "the proposal as a whole";
}

export type RemarkStatus = "open" | "addressed" | "resolved";

export interface RemarkParty {
  id: string;
  roles: readonly Role[];
}

export interface RemarkContext {
  authorId: string;
  assignedReviewerIds: readonly string[];
  familyCuratorIds: readonly string[];
}

const isCurator = (p: RemarkParty, c: RemarkContext) => p.roles.includes("curator") && c.familyCuratorIds.includes(p.id);
const isReviewer = (p: RemarkParty, c: RemarkContext) => c.assignedReviewerIds.includes(p.id) && p.id !== c.authorId;

/**
 * Whoever may open the proposal reads its discussion: every review role, as on the board and the review workspace.
 * The same rule decides who hears of an @mention, so a mail never carries a remark to someone who may not read it.
 */
export const REMARK_READER_ROLES: readonly Role[] = BOARD_ROLES;

export function mayReadRemarks(p: { roles: readonly Role[] }): boolean {
  return p.roles.some((r) => REMARK_READER_ROLES.includes(r));
}

/** The discussion closes with the proposal: once it is released, declined or withdrawn, remarks are read-only. */
export function isDiscussionOpen(stage: Stage): boolean {
  return !CLOSED_STAGES.includes(stage);
}

/** The author, assigned reviewers and the family's curators take part in the discussion. */
export function mayWriteRemark(p: RemarkParty, c: RemarkContext): boolean {
  return p.id === c.authorId || isReviewer(p, c) || isCurator(p, c);
}

/** Only reviewers and curators can block acceptance with a remark. */
export function mayFlagBlocking(p: RemarkParty, c: RemarkContext): boolean {
  return isReviewer(p, c) || (isCurator(p, c) && p.id !== c.authorId);
}

export type RemarkAction = "address" | "resolve" | "reopen";

/**
 * open → addressed: the proposal's author says it is dealt with; addressed → resolved: the remark's writer (or a
 * curator) agrees; a resolved or addressed remark can be reopened by its writer or a curator.
 */
export function decideRemarkAction(p: RemarkParty, c: RemarkContext, remark: { writerId: string; status: RemarkStatus }, action: RemarkAction): string | null {
  const writerOrCurator = p.id === remark.writerId || (isCurator(p, c) && p.id !== c.authorId);
  if (action === "address") {
    if (p.id !== c.authorId) return "Only the proposal's author marks a remark addressed.";
    return remark.status === "open" ? null : "Only an open remark can be marked addressed.";
  }
  if (action === "resolve") {
    if (!writerOrCurator) return "Only the remark's writer or a curator of the family resolves it.";
    if (p.id === c.authorId) return "The proposal's author cannot resolve remarks on it.";
    return remark.status === "resolved" ? "It is resolved already." : null;
  }
  if (!writerOrCurator) return "Only the remark's writer or a curator of the family reopens it.";
  return remark.status === "open" ? "It is open already." : null;
}

export function nextStatus(action: RemarkAction): RemarkStatus {
  return action === "address" ? "addressed" : action === "resolve" ? "resolved" : "open";
}

/** @mentions by the local part of a colleague's e-mail address, e.g. @noor.haddad. */
export function mentionedHandles(body: string): string[] {
  const out = new Set<string>();
  for (const m of body.matchAll(/(^|[^\w@.])@([a-z0-9][a-z0-9._-]*[a-z0-9])/gi)) out.add(m[2].toLowerCase());
  return [...out];
}
