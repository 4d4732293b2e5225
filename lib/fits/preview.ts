import { previewDocumentFit } from "@/lib/tb/analysis/fit-document";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { buildFitProblem, type StoredReference } from "./problem";
import type { FitSpec } from "./spec";

/** Points drawn in the preview plot at most; beyond this every n-th point is drawn (the counts stay exact). */
export const PREVIEW_PLOT_POINTS = 6000;

export interface FitPreviewBand {
  modelBand: number;
  referenceBand: number;
  points: number;
  minWeight: number;
  maxWeight: number;
}

export interface FitPreview {
  parameters: number;
  /** (k, band) values that enter the fit. */
  points: number;
  kPoints: number;
  /** Reference values left out by the window, the band offset or a zero weight. */
  excluded: number;
  shift: number;
  /** Free parameters the selected values do not depend on (their uncertainty would be undetermined). */
  insensitive: string[];
  /** The free parameters are not determined together (a start would be refused). */
  undetermined: boolean;
  perBand: FitPreviewBand[];
  plot: {
    distance: number[];
    /** Model bands at the start values, one row per reference k-point. */
    model: number[][];
    /** [distance, aligned reference energy, weight] of points in the fit. */
    included: [number, number, number][];
    /** [distance, aligned reference energy] of points left out. */
    excluded: [number, number][];
    stride: number;
    /** High-symmetry points of the default path, at their positions (1/Å). */
    ticks: { distance: number; label: string }[];
  };
}

/** Ticks of the default path; two labels at one position (a jump, e.g. U then K) become one, "U|K". */
function pathTicks(doc: ModelDocument): { distance: number; label: string }[] {
  const path = samplePath(doc);
  const out: { distance: number; label: string }[] = [];
  for (const t of path.ticks) {
    const distance = path.distance[t.index];
    const last = out[out.length - 1];
    if (last && last.distance === distance) last.label = `${last.label}|${t.label}`;
    else out.push({ distance, label: t.label });
  }
  return out;
}

export function buildFitPreview(doc: ModelDocument, reference: StoredReference, spec: FitSpec): FitPreview {
  const problem = buildFitProblem(doc, reference, spec);
  const preview = previewDocumentFit(doc, problem.keys, problem.reference, problem.options);
  const { distance } = problem;
  const inFit = new Set(preview.pairs.map((p) => `${p.k}:${p.referenceBand}`));
  const perBand = new Map<number, FitPreviewBand>();
  for (const p of preview.pairs) {
    const b = perBand.get(p.referenceBand) ?? { modelBand: p.modelBand, referenceBand: p.referenceBand, points: 0, minWeight: Infinity, maxWeight: 0 };
    b.points++;
    b.minWeight = Math.min(b.minWeight, p.weight);
    b.maxWeight = Math.max(b.maxWeight, p.weight);
    perBand.set(p.referenceBand, b);
  }
  const excluded: [number, number][] = [];
  let total = 0;
  problem.reference.energies.forEach((row, k) =>
    row.forEach((e, b) => {
      if (e === null) return;
      total++;
      if (!inFit.has(`${k}:${b}`)) excluded.push([distance[k], e + preview.shift]);
    }),
  );
  const included = preview.pairs.map((p): [number, number, number] => [distance[p.k], (problem.reference.energies[p.k][p.referenceBand] as number) + preview.shift, p.weight]);
  const stride = Math.max(1, Math.ceil((included.length + excluded.length) / PREVIEW_PLOT_POINTS));
  const every = <T,>(xs: T[]) => (stride === 1 ? xs : xs.filter((_, i) => i % stride === 0));
  return {
    parameters: problem.keys.length,
    points: preview.pairs.length,
    kPoints: new Set(preview.pairs.map((p) => p.k)).size,
    excluded: total - preview.pairs.length,
    shift: preview.shift,
    insensitive: preview.insensitive,
    undetermined: preview.undetermined,
    perBand: [...perBand.values()].sort((a, b) => a.referenceBand - b.referenceBand),
    plot: { distance, model: preview.energies, included: every(included), excluded: every(excluded), stride, ticks: pathTicks(doc) },
  };
}
