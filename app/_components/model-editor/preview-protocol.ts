import type { CheckResult } from "@/lib/tb/analysis/check-result";
import type { GapResult } from "@/lib/tb/analysis/gaps";
import type { ModelDocument } from "@/lib/tb/document";

/** Messages between the editor and its band worker. */
export type PreviewRequest = { kind: "base"; doc: ModelDocument | null } | { kind: "proposal"; seq: number; doc: ModelDocument };

export interface GapSummary {
  text: string;
  /** eV, null for a metal or when the gap could not be found. */
  value: number | null;
}

export interface PreviewResult {
  kind: "result";
  seq: number;
  distance: number[];
  ticks: { index: number; label: string }[];
  energies: number[][];
  /** The base on the same path; null when there is no base or it cannot be drawn (see baseNote). */
  baseEnergies: number[][] | null;
  baseNote: string | null;
  gap: GapSummary;
  baseGap: GapSummary | null;
  /** Only for a metal: where the Fermi level falls, eV. */
  fermiLevel: number | null;
  checks: CheckResult[];
  millis: number;
}

export type PreviewResponse = PreviewResult | { kind: "failed"; seq: number; message: string };

export function describeGap(gap: GapResult): GapSummary {
  if (gap.kind === "metal") return { text: `none: metal (${gap.reason})`, value: null };
  const where = (label: string | undefined) => label ?? "on path";
  const character = gap.direct ? "direct" : "indirect";
  return { text: `${gap.value.toFixed(3)} eV, ${character} (VBM ${where(gap.vbm.label)} → CBM ${where(gap.cbm.label)})`, value: gap.value };
}
