import { basisSize, basisTooLargeMessage } from "./basis";
import { MODEL_DOCUMENT_SCHEMA, type ModelDocument } from "./document-schema";
import { validateSemantics } from "./document-validate";

export type { ModelDocument, SiteSpec, ShellSpec, HoppingSpec, KPathSpec } from "./document-schema";
export { MODEL_DOCUMENT_SCHEMA } from "./document-schema";

export interface DocumentIssue {
  path: string;
  message: string;
}

export class ModelDocumentError extends Error {
  readonly issues: DocumentIssue[];
  constructor(issues: DocumentIssue[]) {
    super(`invalid model document: ${issues.map((i) => `${i.path || "(document)"}: ${i.message}`).join("; ")}`);
    this.name = "ModelDocumentError";
    this.issues = issues;
  }
}

export function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((acc, part) => {
    if (typeof part === "number") return `${acc}[${part}]`;
    const name = String(part);
    return acc ? `${acc}.${name}` : name;
  }, "");
}

/** Schema check only: every problem with its field path. Empty when the document has the right shape. */
export function schemaIssues(input: unknown): DocumentIssue[] {
  const result = MODEL_DOCUMENT_SCHEMA.safeParse(input);
  if (result.success) return [];
  return result.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
}

export interface ValidationReport {
  document: ModelDocument | null;
  errors: DocumentIssue[];
  /** Not fatal: e.g. a parameter without a citation or a reason. */
  warnings: DocumentIssue[];
  /** Set when the basis is above `maxBasis`: the document was refused before its meaning was checked. */
  oversize?: { basis: number; limit: number };
}

export interface ValidationOptions {
  /** The largest basis (states of H(k)) to accept; larger documents are refused before the costlier checks. */
  maxBasis?: number;
}

/** Shape and meaning checks together; never throws. */
export function validateModelDocument(input: unknown, opts: ValidationOptions = {}): ValidationReport {
  const result = MODEL_DOCUMENT_SCHEMA.safeParse(input);
  if (!result.success) {
    return { document: null, errors: result.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })), warnings: [] };
  }
  if (opts.maxBasis !== undefined && basisSize(result.data) > opts.maxBasis) {
    const message = basisTooLargeMessage(result.data, opts.maxBasis);
    return { document: null, errors: [{ path: "sites", message }], warnings: [], oversize: { basis: basisSize(result.data), limit: opts.maxBasis } };
  }
  const { errors, warnings } = validateSemantics(result.data);
  return { document: errors.length ? null : result.data, errors, warnings };
}

/** Parses and validates a model document; throws ModelDocumentError naming every bad field. */
export function parseModelDocument(input: unknown): ModelDocument {
  const report = validateModelDocument(input);
  if (!report.document) throw new ModelDocumentError(report.errors);
  return report.document;
}
