import type { ModelDocument } from "@/lib/tb/document";
import { listParameters } from "@/lib/tb/parameters";

/** One parameter whose value differs between two documents (or exists in only one). */
export interface ParameterChange {
  key: string;
  label: string;
  base: number | null;
  proposed: number | null;
}

export function changedParameters(base: ModelDocument | null, proposed: ModelDocument): ParameterChange[] {
  const before = new Map((base ? listParameters(base) : []).map((p) => [p.key, p]));
  const after = new Map(listParameters(proposed).map((p) => [p.key, p]));
  const out: ParameterChange[] = [];
  for (const [key, p] of after) {
    const old = before.get(key);
    if (!old || old.value !== p.value) out.push({ key, label: p.label, base: old?.value ?? null, proposed: p.value });
  }
  for (const [key, p] of before) if (!after.has(key)) out.push({ key, label: p.label, base: p.value, proposed: null });
  return out;
}

const blank = (s: string | undefined) => !s || s.trim().length === 0;

/**
 * What a proposal still lacks before it may be submitted: the provenance record, a validity range, and a citation
 * or a reason for every changed parameter. Each message names the field, so the form can say exactly what is missing.
 */
export function submissionProblems(base: ModelDocument | null, proposed: ModelDocument): string[] {
  const p = proposed.provenance;
  const problems: string[] = [];
  const need = (value: string | undefined, what: string) => blank(value) && problems.push(`Provenance: ${what} is missing.`);
  need(p.referenceMethod, "reference method");
  need(p.referenceCode, "code and version");
  need(p.functional, "functional (or 'not applicable' with the method)");
  need(p.structureSource, "structure source");
  need(p.kMesh, "k-mesh");
  if (p.fitWindow && blank(p.fitWeights)) problems.push("Provenance: fit weights are missing (a fit window is given).");
  if (!p.fitWindow && !blank(p.fitWeights)) problems.push("Provenance: fit window is missing (fit weights are given).");
  const v = proposed.validity;
  if (!v.strain && !v.temperature && !v.energyWindow) problems.push("Validity range: give at least one of strain, temperature or energy window.");
  for (const change of changedParameters(base, proposed)) {
    if (change.proposed === null) continue;
    if (blank(p.citations[change.key])) problems.push(`Citation or reason missing for changed parameter ${change.label} (${change.key}).`);
  }
  return problems;
}
