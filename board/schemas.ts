import { z } from "zod";
import { withoutNul } from "@/lib/pg-text";
import { DOCUMENT_MAX_BYTES, DOCUMENT_TOO_LARGE, utf8Length } from "@/lib/size-limits";
import { STAGES, VERDICTS } from "./stages";

/** Inputs of the board's use-cases, shared by server actions, route handlers and forms. */

const id = (what: string) => z.uuid({ error: `Unknown ${what}.` });
const version = z.coerce.number({ error: "Missing card version." }).int().min(1);
const reason = z.string().trim().max(2000, { error: "Use at most 2,000 characters." }).optional();

export const moveInput = z.object({ proposalId: id("proposal"), version, to: z.enum(STAGES, { error: "Unknown stage." }), reason });
export type MoveInput = z.infer<typeof moveInput>;

export const assignInput = z.object({ proposalId: id("proposal"), version, reviewerId: id("reviewer") });
export type AssignInput = z.infer<typeof assignInput>;

export const waiveInput = z.object({
  proposalId: id("proposal"),
  version,
  reason: z.string().trim().min(10, { error: "Write why (at least 10 characters)." }).max(2000),
});
export type WaiveInput = z.infer<typeof waiveInput>;

const title = z.string({ error: "Give the proposal a title." }).trim().min(3, { error: "Use at least 3 characters." }).max(200, { error: "Use at most 200 characters." });
const rationale = z.string().max(20_000, { error: "Use at most 20,000 characters." }).default("");

/**
 * The document: JSON text from forms (its size is checked before it is parsed), or an object from the JSON API.
 * Its content is validated by the engine, not here.
 */
const documentInput = z.unknown().transform((value, ctx) => {
  if (typeof value !== "string") {
    if (typeof value === "object" && value !== null && !Array.isArray(value)) return value as Record<string, unknown>;
    ctx.addIssue({ code: "custom", message: "The model document is missing." });
    return z.NEVER;
  }
  if (utf8Length(value) > DOCUMENT_MAX_BYTES) {
    ctx.addIssue({ code: "custom", message: DOCUMENT_TOO_LARGE });
    return z.NEVER;
  }
  try {
    return JSON.parse(value) as unknown;
  } catch {
    ctx.addIssue({ code: "custom", message: "The model document is not valid JSON." });
    return z.NEVER;
  }
});

export const createProposalInput = z.object({
  familySlug: z.string().trim().min(1, { error: "Choose a model family." }).max(100),
  baseReleaseId: z.preprocess((v) => (v === "" || v === "blank" ? null : v), id("release").nullable()).default(null),
  title,
  rationale,
});
export type CreateProposalInput = z.infer<typeof createProposalInput>;

export const saveRevisionInput = z.object({
  proposalId: id("proposal"),
  version,
  document: documentInput,
  note: z.string().trim().max(2000).default(""),
});
export type SaveRevisionInput = z.infer<typeof saveRevisionInput>;

export const editTextInput = z.object({ proposalId: id("proposal"), version, title, rationale });
export type EditTextInput = z.infer<typeof editTextInput>;

export const verdictInput = z.object({
  proposalId: id("proposal"),
  verdict: z.enum(VERDICTS, { error: "Choose a verdict." }),
  summary: z.string().trim().min(1, { error: "Write a short summary." }).max(20_000),
});
export type VerdictInput = z.infer<typeof verdictInput>;

const listParam = z.preprocess((v) => (typeof v === "string" ? v.split(",").filter(Boolean) : v), z.array(withoutNul(z.string().max(200))).default([]));

export const boardFilters = z.object({
  family: listParam,
  author: z.uuid().optional().catch(undefined),
  mine: z.enum(["assigned", "authored"]).optional().catch(undefined),
  stage: z.preprocess((v) => (typeof v === "string" ? v.split(",").filter(Boolean) : v), z.array(z.enum(STAGES)).default([])).catch([]),
});
export type BoardFilters = z.infer<typeof boardFilters>;
