import { validateModelDocument, type DocumentIssue, type ModelDocument } from "./document";
import { documentHash, physicsHash } from "./canonical";

export interface CheckOutcome {
  id: string;
  title: string;
  status: "pass" | "fail" | "warn";
  detail: string;
}

/** A check run by `tb check` on a valid document; physics checks append themselves here. */
export type CheckStep = (doc: ModelDocument) => CheckOutcome[] | Promise<CheckOutcome[]>;

export const CHECK_STEPS: CheckStep[] = [];

export interface CheckReport {
  valid: boolean;
  errors: DocumentIssue[];
  warnings: DocumentIssue[];
  documentHash?: string;
  physicsHash?: string;
  checks: CheckOutcome[];
}

/** Schema, meaning and conventions first; the registered checks only when those pass. */
export async function checkDocument(raw: unknown, steps: CheckStep[] = CHECK_STEPS): Promise<CheckReport> {
  const report = validateModelDocument(raw);
  if (!report.document) return { valid: false, errors: report.errors, warnings: report.warnings, checks: [] };
  const doc = report.document;
  const checks: CheckOutcome[] = [
    { id: "document", title: "Schema, conventions and meaning", status: report.warnings.length ? "warn" : "pass", detail: `${report.warnings.length} warning(s)` },
  ];
  for (const step of steps) checks.push(...(await step(doc)));
  return { valid: true, errors: [], warnings: report.warnings, documentHash: documentHash(doc), physicsHash: physicsHash(doc), checks };
}
