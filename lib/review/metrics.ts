import { resolveReferenceBands } from "@/lib/reference-bands";
import type { ModelDocument } from "@/lib/tb/document";
import { createDocumentMetrics } from "@/lib/tb/analysis/metrics";
import type { Alignment } from "./alignment";
import { errorRows } from "./band-error-rows";
import { bandwidthRows, gapRows } from "./band-gap-rows";
import { freeElectronRows, massRows } from "./band-mass-rows";
import type { MetricsReference, MetricsRow, MetricsSide } from "./band-rows";
import type { ReferenceInput } from "./band-view";

export type { MetricsRow } from "./band-rows";

export interface MetricsOptions {
  /** On the aligned reference energies, i.e. the model's energy scale (eV). */
  window: [number, number] | null;
  alignment: Alignment;
}

function resolveReference(proposed: ModelDocument, reference: ReferenceInput | null): MetricsReference | null {
  if (!reference) return null;
  try {
    const r = resolveReferenceBands(proposed, reference.parsed, reference.parsed.pointsTotal);
    return { name: reference.name, bands: r, fermiLevel: reference.parsed.fermiLevel };
  } catch {
    // a reference that does not fit the proposed path cannot be compared; the table then shows no reference column values
    return null;
  }
}

/** Base vs proposed vs reference: gap, bandwidths, edge masses, free-electron mass, per-band errors in the window. */
export function buildMetrics(proposed: ModelDocument, base: ModelDocument | null, reference: ReferenceInput | null, opts: MetricsOptions): MetricsRow[] {
  const ref = resolveReference(proposed, reference);
  const side = (doc: ModelDocument): MetricsSide => ({ doc, metrics: createDocumentMetrics(doc, ref?.bands) });
  const p = side(proposed);
  const b = base && base.lattice.dimension === proposed.lattice.dimension ? side(base) : null;
  return [
    ...gapRows(b, p, ref),
    ...massRows(b, p),
    ...freeElectronRows(b, p, ref),
    ...bandwidthRows(b, p, ref),
    ...errorRows(b, p, ref, opts),
  ];
}
