import { computeBands } from "@/lib/tb/bands";
import { previewDocumentFit } from "@/lib/tb/analysis/fit-document";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { buildFitProblem, type StoredReference } from "./problem";
import type { FitOutcome } from "./record";
import type { FitSpec } from "./spec";

/** What the fit-quality plots draw: start and fitted bands on the default path, the aligned reference, residuals. */
export interface FitQuality {
  distance: number[];
  ticks: { index: number; label: string }[];
  start: number[][];
  fitted: number[][];
  reference: { distance: number[]; energies: (number | null)[][] };
  /** [path position, fitted − aligned reference (eV), model band] for every value in the fit. */
  residuals: [number, number, number][];
  window: [number, number] | null;
}

const rows = (e: ArrayLike<number>[]) => e.map((r) => Array.from(r));

export function buildFitQuality(start: ModelDocument, fitted: ModelDocument, reference: StoredReference, spec: FitSpec, outcome: FitOutcome): FitQuality {
  const path = samplePath(fitted);
  const problem = buildFitProblem(start, reference, spec);
  // The fit chose its values at the start point; the same selection is made again here.
  const { pairs } = previewDocumentFit(start, problem.keys, problem.reference, problem.options);
  const atReference = computeBands(compileModel(fitted), problem.reference.kFrac).energies;
  const residuals = pairs.map((p): [number, number, number] => [
    problem.distance[p.k],
    atReference[p.k][p.modelBand] - ((problem.reference.energies[p.k][p.referenceBand] as number) + outcome.shift),
    p.modelBand,
  ]);
  const offset = spec.bandOffset;
  return {
    distance: path.distance,
    ticks: path.ticks,
    start: rows(computeBands(compileModel(start), path.kFrac).energies),
    fitted: rows(computeBands(compileModel(fitted), path.kFrac).energies),
    reference: {
      distance: problem.distance,
      // Reference band n + offset is drawn as model band n, shifted onto the model's energy zero.
      energies: problem.reference.energies.map((row) => row.slice(Math.max(0, offset)).map((e) => (e === null ? null : e + outcome.shift))),
    },
    residuals,
    window: spec.window,
  };
}
