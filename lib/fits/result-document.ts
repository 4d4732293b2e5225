import type { ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { previewDocumentFit } from "@/lib/tb/analysis/fit-document";
import { buildFitProblem, type StoredReference } from "./problem";
import type { FitOutcome } from "./record";
import type { FitSpec } from "./spec";

export interface FitReferenceInfo {
  name: string;
  provenance: Record<string, string | undefined>;
}

/** How the points were weighted, in words, for the document's provenance. */
export function describeFitWeights(spec: FitSpec): string {
  const parts = [`alignment ${spec.alignment}`, `band offset ${spec.bandOffset}`];
  parts.push(spec.bandWeights.length ? `band weights ${spec.bandWeights.map((w) => `${w.band}:${w.weight}`).join(", ")}` : "band weights all 1");
  if (spec.regionWeights.length) parts.push(`region weights ${spec.regionWeights.map((r) => `[${r.from}, ${r.to}] 1/Å:${r.weight}`).join(", ")}`);
  return parts.join("; ");
}

function formatUncertainty(value: number, se: number | undefined): string {
  if (se === undefined || !Number.isFinite(se)) return `${value.toPrecision(6)} eV (uncertainty not determined)`;
  return `${value.toPrecision(6)} ± ${se.toPrecision(2)} eV (1σ)`;
}

/**
 * The energy range (model scale, eV) the fit actually covered: the chosen window, or, with none, the span of the
 * aligned reference values that entered it — so the provenance always states a fit window.
 */
export function fittedEnergyRange(start: ModelDocument, parsed: StoredReference, spec: FitSpec, shift: number): [number, number] {
  if (spec.window) return spec.window;
  const problem = buildFitProblem(start, parsed, spec);
  const { pairs } = previewDocumentFit(start, problem.keys, problem.reference, problem.options);
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of pairs) {
    const e = (problem.reference.energies[p.k][p.referenceBand] as number) + shift;
    lo = Math.min(lo, e);
    hi = Math.max(hi, e);
  }
  const round = (x: number, f: (v: number) => number) => f(x * 1000) / 1000;
  return [round(lo, Math.floor), round(hi, Math.ceil)];
}

/**
 * The document a fit produces: the fitted values, and provenance that says how they were obtained — the
 * reference's method and code, the fit window (see fittedEnergyRange) and weights, and a citation for every fitted
 * parameter naming the fit.
 */
export function fittedDocument(
  start: ModelDocument,
  outcome: FitOutcome,
  spec: FitSpec,
  reference: FitReferenceInfo,
  fitId: string,
  energyRange: [number, number],
): ModelDocument {
  const doc = setParameters(start, Object.fromEntries(outcome.names.map((k, i) => [k, outcome.values[i]])));
  const ref = reference.provenance;
  const citations = { ...doc.provenance.citations };
  outcome.names.forEach((key, i) => {
    citations[key] = `refit to reference bands "${reference.name}" (fit ${fitId.slice(0, 8)}): ${formatUncertainty(outcome.values[i], outcome.standardErrors?.[i])}`;
  });
  return {
    ...doc,
    provenance: {
      ...doc.provenance,
      fitWindow: energyRange,
      referenceMethod: ref.method ?? doc.provenance.referenceMethod,
      referenceCode: ref.code ?? doc.provenance.referenceCode,
      functional: ref.functional ?? doc.provenance.functional,
      structureSource: ref.structureSource ?? doc.provenance.structureSource,
      fitWeights: describeFitWeights(spec),
      citations,
    },
  };
}
