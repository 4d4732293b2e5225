import { ReferenceBandsError, resolveReferenceBands, type ParsedReferenceBands } from "@/lib/reference-bands";
import type { ReferenceBands } from "@/lib/tb/analysis/compare-reference";
import type { DocumentFitOptions } from "@/lib/tb/analysis/fit-document";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import type { ModelDocument } from "@/lib/tb/document";
import type { FitSpec } from "./spec";

/** A fit spec turned into the engine's terms: keys, the reference on the document's k-points, options. */
export interface FitProblem {
  keys: string[];
  reference: ReferenceBands;
  /** Position of each reference point along the default path (1/Å), for region weights and plots. */
  distance: number[];
  options: DocumentFitOptions;
}

export type StoredReference = ParsedReferenceBands & { pointsTotal?: number };

export function buildFitProblem(doc: ModelDocument, parsed: StoredReference, spec: FitSpec): FitProblem {
  let resolved;
  try {
    resolved = resolveReferenceBands(doc, parsed, parsed.pointsTotal);
  } catch (err) {
    if (err instanceof ReferenceBandsError) throw new FitInputError(`fit: the reference set does not fit this model's k-path: ${err.message}`);
    throw err;
  }
  const reference = { kFrac: resolved.kFrac, energies: resolved.energies };
  const bandWeights = Object.fromEntries(spec.bandWeights.map((w) => [w.band, w.weight]));
  const pointWeights =
    spec.regionWeights.length === 0
      ? undefined
      : resolved.distance.map((d, k) => {
          const w = spec.regionWeights.reduce((acc, r) => (d >= r.from && d <= r.to ? acc * r.weight : acc), 1);
          return reference.energies[k].map(() => w);
        });
  return {
    keys: spec.parameters.map((p) => p.key),
    reference,
    distance: resolved.distance,
    options: {
      window: spec.window ?? undefined,
      bandOffset: spec.bandOffset,
      alignment: spec.alignment,
      bandWeights,
      pointWeights,
      lower: spec.parameters.map((p) => p.lower ?? -Infinity),
      upper: spec.parameters.map((p) => p.upper ?? Infinity),
      maxIterations: spec.maxIterations,
      restarts: spec.restarts,
      seed: spec.seed,
    },
  };
}
