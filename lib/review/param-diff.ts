import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { checkGaugeChange } from "@/lib/tb/analysis/gauge";
import { DEFAULT_EFFECT_OPTIONS, estimateChangeEffects, type ValueChange } from "./param-diff-effect";
import { listMeaningfulParameters, type MeaningfulParameter } from "./param-diff-labels";
import { sortParamRows } from "./param-diff-sort";
import { listStructuralChanges, type StructuralChange } from "./param-diff-structure";

export type { StructuralChange, StructuralKind } from "./param-diff-structure";

export interface ParamDiffRow {
  /** listParameters key (of the proposed document; of the base for a removed parameter). */
  key: string;
  group: string;
  label: string;
  /** null = added */
  base: number | null;
  /** null = removed */
  proposed: number | null;
  delta: number | null;
  /** 100·Δ/|base|; null when the base is zero or absent. */
  percent: number | null;
  signFlip: boolean;
  /** Largest |ΔE| (eV) this change alone causes inside the window, along the base document's default path. */
  effect: number | null;
  effectMethod: "first-order" | "exact" | null;
}

export type GaugeVerdictKind = "identical" | "no physical change" | "physical change";

export interface ParameterDiff {
  /** Changed parameters only, sorted by |effect|, then |%Δ|, then key. */
  rows: ParamDiffRow[];
  structural: StructuralChange[];
  gauge: { verdict: GaugeVerdictKind; explanation: string };
  /** The energy window the effects were measured in (eV, base energies); null = every band. */
  window: [number, number] | null;
}

export interface ParameterDiffOptions {
  window?: [number, number];
  /** k-points along the base document's default path (default 120: a smooth max |ΔE| needs no finer sampling). */
  kPoints?: number;
  /** Rows (largest first) whose effect is recomputed exactly; the rest keep the first-order estimate. */
  exactRows?: number;
}

const DEFAULT_EFFECT_POINTS = 120;

export function buildParameterDiff(base: ModelDocument | null, proposed: ModelDocument, opts: ParameterDiffOptions = {}): ParameterDiff {
  const window = opts.window ?? proposed.validity.energyWindow ?? base?.validity.energyWindow ?? null;
  if (!base) {
    const rows = listMeaningfulParameters(proposed).filter((p) => !p.implicit).map((p) => row(p.key, p, null, p.value));
    return { rows: sortParamRows(rows, "effect"), structural: [], gauge: { verdict: "physical change", explanation: "there is no base release: every parameter is new" }, window };
  }
  const before = new Map(listMeaningfulParameters(base).map((p) => [p.meaning, p]));
  const after = listMeaningfulParameters(proposed);
  const proposedKeys = new Set(after.map((p) => p.key));
  const rows: ParamDiffRow[] = [];
  const valueChanges: (ValueChange & { row: ParamDiffRow })[] = [];
  for (const p of after) {
    const old = before.get(p.meaning);
    before.delete(p.meaning);
    if ((old && old.value === p.value) || (!old && p.implicit)) continue;
    const r = row(p.key, p, old?.value ?? null, p.value);
    rows.push(r);
    if (old) valueChanges.push({ key: old.key, proposed: p.value, delta: p.value - old.value, row: r });
  }
  // A removed hopping can share its list-index key with a different hopping of the proposal.
  for (const old of before.values()) if (!old.implicit) rows.push(row(proposedKeys.has(old.key) ? `${old.key}@base` : old.key, old, old.value, null));
  const kFrac = samplePath(base, opts.kPoints ?? DEFAULT_EFFECT_POINTS).kFrac;
  const effects = estimateChangeEffects(base, valueChanges, kFrac, window ?? [-Infinity, Infinity], {
    ...DEFAULT_EFFECT_OPTIONS,
    ...(opts.exactRows !== undefined ? { exactRows: opts.exactRows } : {}),
  });
  for (const c of valueChanges) {
    const e = effects.get(c.key);
    if (e) Object.assign(c.row, { effect: e.effect, effectMethod: e.method });
  }
  const structural = listStructuralChanges(base, proposed);
  const reordered = rows.length === 0 && structural.length === 0 && base.conventions.blochPhase === proposed.conventions.blochPhase;
  const gauge = reordered
    ? { verdict: "identical" as const, explanation: "no parameter changed; sites, shells or hoppings are only listed in another order" }
    : judgeGauge(base, proposed);
  return { rows: sortParamRows(rows, "effect"), structural, gauge, window };
}

function row(key: string, p: MeaningfulParameter, base: number | null, proposed: number | null): ParamDiffRow {
  const delta = base !== null && proposed !== null ? proposed - base : null;
  return {
    key,
    group: p.group,
    label: p.label,
    base,
    proposed,
    delta,
    percent: delta !== null && base !== 0 && base !== null ? (100 * delta) / Math.abs(base) : null,
    signFlip: base !== null && proposed !== null && Math.sign(base) * Math.sign(proposed) < 0,
    effect: null,
    effectMethod: null,
  };
}

function judgeGauge(base: ModelDocument, proposed: ModelDocument): ParameterDiff["gauge"] {
  const g = checkGaugeChange(base, proposed);
  if (base.electronCount !== proposed.electronCount) {
    const h = g.status === "physical change" ? g.explanation : `H(k): ${g.status} (${g.explanation})`;
    return { verdict: "physical change", explanation: `the electron count changed (${base.electronCount} → ${proposed.electronCount}); ${h}` };
  }
  return { verdict: g.status, explanation: g.explanation };
}
