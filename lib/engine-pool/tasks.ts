import { compareBandsOnPath } from "@/board/band-comparison";
import { deriveRevisionFacts } from "@/board/revision-facts";
import { buildModelView } from "@/lib/families/view";
import { buildFitPreview } from "@/lib/fits/preview";
import type { StoredReference } from "@/lib/fits/problem";
import { buildFitQuality } from "@/lib/fits/quality";
import type { FitOutcome } from "@/lib/fits/record";
import { fittedDocument, fittedEnergyRange, type FitReferenceInfo } from "@/lib/fits/result-document";
import type { FitSpec } from "@/lib/fits/spec";
import { parseReferenceBands, referenceChecksum, ReferenceBandsError, resolveReferenceBands, type ReferenceIssue } from "@/lib/reference-bands";
import { bandsAtPoints, bandsOnDefaultPath, releaseHoppings } from "@/lib/registry/downloads";
import { buildBandView } from "@/lib/review/band-view";
import { buildMetrics } from "@/lib/review/metrics";
import { buildParameterDiff } from "@/lib/review/param-diff";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import { validateModelDocument, type ModelDocument } from "@/lib/tb/document";

/**
 * What a web request may ask the engine threads to compute: pure functions of plain data (structured clone both
 * ways). Failures a caller answers in words come back as values, since a thrown error loses its class on the way.
 */
export const ENGINE_TASKS = {
  validateDocument: (raw: unknown, maxBasis: number) => validateModelDocument(raw, { maxBasis }),
  revisionFacts: deriveRevisionFacts,
  bandView: buildBandView,
  metrics: buildMetrics,
  parameterDiff: buildParameterDiff,
  bandComparison: compareBandsOnPath,
  modelView: buildModelView,
  bandsOnPath: bandsOnDefaultPath,
  bandsAtPoints,
  hoppings: releaseHoppings,
  fitQuality: buildFitQuality,
  fitPreview(doc: ModelDocument, reference: StoredReference, spec: FitSpec) {
    try {
      return { ok: true as const, preview: buildFitPreview(doc, reference, spec) };
    } catch (err) {
      if (err instanceof FitInputError) return { ok: false as const, message: err.message };
      throw err;
    }
  },
  /** The revision a finished fit becomes: its values on `onto`, with provenance from the fit (start: the fitted revision). */
  fittedDocument(start: ModelDocument, onto: ModelDocument, reference: StoredReference, spec: FitSpec, outcome: FitOutcome, info: FitReferenceInfo, fitId: string) {
    return fittedDocument(onto, outcome, spec, info, fitId, fittedEnergyRange(start, reference, spec, outcome.shift));
  },
  /** A reference band file parsed and placed on the model's path; its problems with line and column otherwise. */
  referenceBands(fileName: string, content: string, doc: ModelDocument, pointsTotal: number) {
    try {
      const parsed = parseReferenceBands(fileName, content);
      resolveReferenceBands(doc, parsed, pointsTotal);
      return { ok: true as const, parsed, sha256: referenceChecksum(content) };
    } catch (err) {
      if (err instanceof ReferenceBandsError) return { ok: false as const, issues: err.issues as ReferenceIssue[] };
      throw err;
    }
  },
};

export type EngineTasks = typeof ENGINE_TASKS;
export type EngineTaskName = keyof EngineTasks;
