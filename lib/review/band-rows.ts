import type { ModelDocument } from "@/lib/tb/document";
import type { ReferenceBands } from "@/lib/tb/analysis/compare-reference";
import type { DocumentMetrics } from "@/lib/tb/analysis/metrics";
import { formatNumber } from "./band-format";

/** One line of the metrics table; bands are counted from 1 (the lowest) in keys and labels. */
export interface MetricsRow {
  /** Stable id, e.g. "gap", "width/3", "mass/cbm/Γ→X", "rms/2". */
  key: string;
  metric: string;
  base: string;
  proposed: string;
  reference: string;
  unit: string;
  /** The numbers behind the text (null for text-only rows or missing values). */
  values: { base: number | null; proposed: number | null; reference: number | null };
}

/** One document's metrics; the base side is null when there is no base release (a new model). */
export interface MetricsSide {
  doc: ModelDocument;
  metrics: DocumentMetrics;
}

export interface MetricsReference {
  name: string;
  bands: ReferenceBands & { distance: number[] };
  fermiLevel: number | null;
}

type Values = MetricsRow["values"];

export function numberRow(key: string, metric: string, unit: string, values: Values, digits = 3): MetricsRow {
  return { key, metric, unit, values, base: formatNumber(values.base, digits), proposed: formatNumber(values.proposed, digits), reference: formatNumber(values.reference, digits) };
}

export function textRow(key: string, metric: string, text: { base?: string; proposed?: string; reference?: string }): MetricsRow {
  return { key, metric, unit: "", values: { base: null, proposed: null, reference: null }, base: text.base ?? "—", proposed: text.proposed ?? "—", reference: text.reference ?? "—" };
}
