import { createDocumentMetrics } from "@/lib/tb/analysis/metrics";
import { validateModelDocument, type ModelDocument } from "@/lib/tb/document";
import { listParameters, type ParameterRef } from "@/lib/tb/parameters";

/** What a family page shows of one model document: its parameters, its bands and the numbers a reader looks for. */
export interface ModelView {
  doc: ModelDocument;
  basisSize: number;
  parameters: ParameterRef[];
  path: { distance: number[]; ticks: { index: number; label: string }[]; energies: number[][] };
  gap: { text: string; value: number | null };
  fermiLevel: number | null;
  validity: string;
}

export type ModelViewResult = { ok: true; view: ModelView } | { ok: false; issues: { path: string; message: string }[] };

function describeRange(range: [number, number] | undefined, unit: string, scale = 1): string | null {
  return range ? `${range[0] * scale} to ${range[1] * scale} ${unit}` : null;
}

export function validityText(doc: ModelDocument): string {
  const v = doc.validity;
  const parts = [
    describeRange(v.strain, "% strain", 100),
    describeRange(v.temperature, "K"),
    describeRange(v.energyWindow, "eV energy window"),
  ].filter(Boolean);
  return parts.length ? parts.join("; ") : "not stated";
}

export function buildModelView(raw: unknown): ModelViewResult {
  const report = validateModelDocument(raw);
  if (!report.document || report.errors.length > 0) return { ok: false, issues: report.errors };
  const doc = report.document;
  const metrics = createDocumentMetrics(doc);
  const { path, energies } = metrics.path();
  const gap = metrics.gap();
  const gapText =
    gap.kind === "insulator"
      ? `${gap.value.toFixed(3)} eV, ${gap.direct ? "direct" : "indirect"} (VBM ${gap.vbm.label ?? "on path"} → CBM ${gap.cbm.label ?? "on path"})`
      : `none: metal (${gap.reason})`;
  return {
    ok: true,
    view: {
      doc,
      basisSize: metrics.model.size,
      parameters: listParameters(doc),
      path: { distance: path.distance, ticks: path.ticks, energies: energies.map((row) => Array.from(row)) },
      gap: { text: gapText, value: gap.kind === "insulator" ? gap.value : null },
      fermiLevel: gap.kind === "metal" ? metrics.fermiLevel() : null,
      validity: validityText(doc),
    },
  };
}
