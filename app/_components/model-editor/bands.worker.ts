import { runDocumentChecks } from "@/lib/tb/analysis/checks";
import { findBandGap } from "@/lib/tb/analysis/gaps";
import { createDocumentMetrics } from "@/lib/tb/analysis/metrics";
import { spinDegeneracyOf } from "@/lib/tb/analysis/model-solver";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import type { SampledPath } from "@/lib/tb/kpath";
import { compileModel, type CompiledModel } from "@/lib/tb/model";
import { describeGap, type GapSummary, type PreviewRequest, type PreviewResponse, type PreviewResult } from "./preview-protocol";

/** Runs the engine off the main thread: bands on the default path, gap and physics checks of each valid draft. */

let base: { doc: ModelDocument; model: CompiledModel } | { error: string } | null = null;
const baseOnPath = new Map<string, { energies: number[][]; gap: GapSummary | null }>();
let pending: Extract<PreviewRequest, { kind: "proposal" }> | null = null;
let scheduled = false;

const message = (error: unknown) => (error instanceof Error ? error.message : String(error));
const toRows = (energies: Float64Array[]) => energies.map((row) => Array.from(row));

function setBase(doc: ModelDocument | null): void {
  baseOnPath.clear();
  try {
    base = doc ? { doc, model: compileModel(doc) } : null;
  } catch (error) {
    base = { error: message(error) };
  }
}

/** The base's bands along the proposal's path: computed once per distinct path (the path only moves with the k-path). */
function baseAlong(path: SampledPath, dimension: number): Pick<PreviewResult, "baseEnergies" | "baseNote" | "baseGap"> {
  if (!base) return { baseEnergies: null, baseNote: null, baseGap: null };
  if ("error" in base) return { baseEnergies: null, baseNote: `base not drawn: ${base.error}`, baseGap: null };
  if (base.model.dimension !== dimension) return { baseEnergies: null, baseNote: "base not drawn: its lattice has another dimension", baseGap: null };
  const key = JSON.stringify(path.kFrac);
  let cached = baseOnPath.get(key);
  if (!cached) {
    const energies = computeBands(base.model, path.kFrac).energies;
    let gap: GapSummary | null = null;
    try {
      const input = { energies, kFrac: path.kFrac, electronCount: base.doc.electronCount, spinDegeneracy: spinDegeneracyOf(base.model), ticks: path.ticks };
      gap = describeGap(findBandGap(input));
    } catch (error) {
      gap = { text: `not found: ${message(error)}`, value: null };
    }
    cached = { energies: toRows(energies), gap };
    baseOnPath.set(key, cached);
  }
  return { baseEnergies: cached.energies, baseNote: null, baseGap: cached.gap };
}

function preview(seq: number, doc: ModelDocument): PreviewResponse {
  const started = performance.now();
  try {
    const metrics = createDocumentMetrics(doc);
    const { path, energies } = metrics.path();
    let gap: GapSummary;
    let fermiLevel: number | null = null;
    try {
      const found = metrics.gap();
      gap = describeGap(found);
      if (found.kind === "metal") fermiLevel = metrics.fermiLevel();
    } catch (error) {
      gap = { text: `not found: ${message(error)}`, value: null };
    }
    const checks = runDocumentChecks(doc);
    return {
      kind: "result",
      seq,
      distance: path.distance,
      ticks: path.ticks,
      energies: toRows(energies),
      ...baseAlong(path, metrics.model.dimension),
      gap,
      fermiLevel,
      checks,
      millis: performance.now() - started,
    };
  } catch (error) {
    return { kind: "failed", seq, message: message(error) };
  }
}

function runLatest(): void {
  scheduled = false;
  const job = pending;
  pending = null;
  if (job) self.postMessage(preview(job.seq, job.doc));
}

self.onmessage = (event: MessageEvent<PreviewRequest>) => {
  const request = event.data;
  if (request.kind === "base") {
    setBase(request.doc);
    return;
  }
  // Requests that queued up during a long computation are superseded: only the newest one runs.
  pending = request;
  if (!scheduled) {
    scheduled = true;
    setTimeout(runLatest, 0);
  }
};
