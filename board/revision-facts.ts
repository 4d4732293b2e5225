import { runDocumentChecks } from "@/lib/tb/analysis/checks";
import { compareBandSets } from "@/lib/tb/analysis/compare";
import type { AcceptanceCriterionInput } from "@/lib/tb/analysis/acceptance";
import type { CheckResult } from "@/lib/tb/analysis/check-result";
import { computeBands } from "@/lib/tb/bands";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { validateModelDocument, type DocumentIssue, type ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";

export const SPARKLINE_POINTS = 48;

/** Everything stored beside a revision's document, computed once when it is saved. */
export interface RevisionFacts {
  sha256: string;
  physicsHash: string;
  checkResults: CheckResult[];
  checksPassing: boolean;
  shiftProfile: number[] | null;
  maxShift: number | null;
}

export type DocumentParse = { ok: true; doc: ModelDocument } | { ok: false; issues: DocumentIssue[] };

export function parseDocument(raw: unknown): DocumentParse {
  const report = validateModelDocument(raw);
  return report.document && report.errors.length === 0 ? { ok: true, doc: report.document } : { ok: false, issues: report.errors };
}

/** Max over equal bins, so a sharp local shift still shows in a short sparkline. */
export function downsampleMax(values: ArrayLike<number>, points: number): number[] {
  if (values.length <= points) return Array.from(values);
  const out: number[] = [];
  for (let i = 0; i < points; i++) {
    const lo = Math.floor((i * values.length) / points);
    const hi = Math.floor(((i + 1) * values.length) / points);
    let m = 0;
    for (let j = lo; j < hi; j++) m = Math.max(m, values[j]);
    out.push(m);
  }
  return out;
}

/** Largest |ΔE| per k along the proposal's default path; null when the two models cannot share a path. */
export function shiftAgainstBase(base: ModelDocument | null, proposed: ModelDocument): { profile: number[]; max: number } | null {
  if (!base || base.lattice.dimension !== proposed.lattice.dimension) return null;
  try {
    const path = samplePath(proposed, 120);
    const diff = compareBandSets(computeBands(compileModel(base), path.kFrac).energies, computeBands(compileModel(proposed), path.kFrac).energies);
    return { profile: downsampleMax(diff.maxAbsPerK, SPARKLINE_POINTS), max: diff.maxAbs };
  } catch {
    return null;
  }
}

export function deriveRevisionFacts(doc: ModelDocument, base: ModelDocument | null, criteria: AcceptanceCriterionInput[]): RevisionFacts {
  const checkResults = runDocumentChecks(doc, { criteria });
  const shift = shiftAgainstBase(base, doc);
  return {
    sha256: documentHash(doc),
    physicsHash: physicsHash(doc),
    checkResults,
    checksPassing: checkResults.every((c) => c.status !== "fail"),
    shiftProfile: shift?.profile ?? null,
    maxShift: shift?.max ?? null,
  };
}
