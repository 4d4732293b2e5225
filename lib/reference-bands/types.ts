/** Where a k-point came from in the uploaded file, so errors found later (on resolving) can still point at it. */
export interface KSource {
  line?: number;
  column?: number;
  path?: string;
  /** Human prefix for messages, e.g. "line 14, column 1 (k_index)" or "k.values[3]". */
  where: string;
}

export type KKind = "index" | "path" | "fractional";

export interface ParsedReferenceBands {
  kKind: KKind;
  /** One row per point: [i] (index), [d] (path distance, 1/Å) or [k1..kd] (fractional). */
  k: number[][];
  /** energies[point][band], eV; null where the file has no value. */
  energies: (number | null)[][];
  fermiLevel: number | null;
  bandCount: number;
  pointCount: number;
  /** One per point; absent on hand-built values. */
  kSources?: KSource[];
}

export interface ReferenceIssue {
  line?: number;
  column?: number;
  path?: string;
  message: string;
}

const SHOWN_IN_MESSAGE = 5;

export class ReferenceBandsError extends Error {
  readonly issues: ReferenceIssue[];

  constructor(issues: ReferenceIssue[]) {
    const shown = issues.slice(0, SHOWN_IN_MESSAGE).map((i) => i.message);
    if (issues.length > SHOWN_IN_MESSAGE) shown.push(`…and ${issues.length - SHOWN_IN_MESSAGE} more`);
    super(`reference bands: ${shown.join("; ")}`);
    this.name = "ReferenceBandsError";
    this.issues = issues;
  }
}

export const REFERENCE_LIMITS = {
  /** 5 MiB of UTF-8. */
  maxBytes: 5 * 1024 * 1024,
  /** Data rows (k-points). */
  maxRows: 20_000,
  /** Band columns. */
  maxBands: 500,
} as const;

/** Stop collecting after this many issues: one bad column in a long file would otherwise repeat on every row. */
export const MAX_ISSUES = 50;

/** Collects issues; throws them together at the end, or at once when the cap is reached. */
export class IssueList {
  readonly items: ReferenceIssue[] = [];

  add(issue: ReferenceIssue): void {
    this.items.push(issue);
    if (this.items.length >= MAX_ISSUES) throw new ReferenceBandsError(this.items);
  }

  throwIfAny(): void {
    if (this.items.length > 0) throw new ReferenceBandsError(this.items);
  }
}

export function fail(issue: ReferenceIssue): never {
  throw new ReferenceBandsError([issue]);
}
