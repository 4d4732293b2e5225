import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { proposals } from "@/db/schema";
import { runEngine } from "@/lib/engine-pool/engine";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { DOCUMENT_MAX_BYTES, DOCUMENT_TOO_LARGE, utf8Length } from "@/lib/size-limits";
import type { AcceptanceCriterionInput } from "@/lib/tb/analysis/acceptance";
import type { DocumentIssue, ModelDocument } from "@/lib/tb/document";
import { getFamilyById, getRelease } from "./queries";
import { parseDocument, type RevisionFacts } from "./revision-facts";

/* What happens to a model document before a revision is written: the size limits, validation and the derived facts
   (checks, hashes, the shift against the base), all computed on an engine thread and before any row is locked. */

export function invalidDocument(issues: DocumentIssue[]): AppError {
  const fieldErrors: Record<string, string[]> = {};
  for (const i of issues) (fieldErrors[i.path || "document"] ??= []).push(i.message);
  return new AppError("invalid:document", `The model document has ${issues.length} problem${issues.length === 1 ? "" : "s"}: ${issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join("; ")}${issues.length > 3 ? "; …" : ""}`, fieldErrors, { issues });
}

/** A document someone sends (form, API, refit): refused whole when too large in bytes or basis, or invalid. */
export async function admitDocument(raw: unknown): Promise<ModelDocument> {
  const bytes = utf8Length(JSON.stringify(raw) ?? "");
  if (bytes > DOCUMENT_MAX_BYTES) throw new AppError("too-large:document", DOCUMENT_TOO_LARGE, { document: [DOCUMENT_TOO_LARGE] }, { bytes, limitBytes: DOCUMENT_MAX_BYTES });
  const report = await runEngine("validateDocument", raw, serverEnv().MODEL_BASIS_LIMIT);
  if (report.oversize) {
    const message = report.errors[0].message;
    throw new AppError("refused:basis-size", message, { document: [message] }, report.oversize);
  }
  if (!report.document) throw invalidDocument(report.errors);
  return report.document;
}

/** A document ready to be a revision: validated, with the facts stored beside it. */
export interface PreparedRevision {
  doc: ModelDocument;
  facts: RevisionFacts;
  /** The base the shift was measured against (a proposal's base never changes). */
  baseReleaseId: string | null;
}

export async function baseDocumentOf(baseReleaseId: string | null): Promise<ModelDocument | null> {
  if (!baseReleaseId) return null;
  const release = await getRelease(db, baseReleaseId);
  const parsed = release ? parseDocument(release.document) : null;
  return parsed && parsed.ok ? parsed.doc : null;
}

/** Derives a revision's facts for a proposal of `familyId` based on `baseReleaseId`, off the event loop and unlocked. */
export async function prepareRevision(target: { familyId: string; baseReleaseId: string | null }, doc: ModelDocument): Promise<PreparedRevision> {
  const [family, base] = await Promise.all([getFamilyById(db, target.familyId), baseDocumentOf(target.baseReleaseId)]);
  const criteria = (family?.acceptanceCriteria ?? []) as AcceptanceCriterionInput[];
  return { doc, facts: await runEngine("revisionFacts", doc, base, criteria), baseReleaseId: target.baseReleaseId };
}

export async function getProposalForRevision(proposalId: string) {
  const [row] = await db.select().from(proposals).where(eq(proposals.id, proposalId));
  if (!row) throw new AppError("not-found:proposal", "That proposal does not exist (it may have been removed).");
  return row;
}
