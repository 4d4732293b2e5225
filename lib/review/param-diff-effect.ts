import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { computeSensitivity, summariseSensitivity } from "@/lib/tb/analysis/sensitivity";

/** A value change of one parameter that exists in the base document under `key`. */
export interface ValueChange {
  key: string;
  proposed: number;
  delta: number;
}

export interface ChangeEffect {
  effect: number;
  method: "first-order" | "exact";
}

export interface EffectOptions {
  /** How many of the largest first-order rows get an exact recompute. */
  exactRows: number;
  /** Upper bound on n³ · k-points · rows spent on exact recomputes (keeps a page request bounded). */
  exactBudget: number;
}

export const DEFAULT_EFFECT_OPTIONS: EffectOptions = { exactRows: 12, exactBudget: 4e8 };

/**
 * Largest |ΔE_n(k)| each change causes on its own, over the k-points and the base bands inside the window:
 * first order |∂E/∂p|·|Δp| from Hellmann–Feynman sensitivities of the base document (degenerate levels get the
 * eigenvalues of the cluster block, whose largest magnitude does not depend on the sign of Δp), then an exact
 * recompute (base with only this parameter changed, band by band in ascending order) for the largest rows.
 */
export function estimateChangeEffects(
  base: ModelDocument,
  changes: ValueChange[],
  kFrac: number[][],
  window: [number, number],
  opts: EffectOptions = DEFAULT_EFFECT_OPTIONS,
): Map<string, ChangeEffect> {
  const out = new Map<string, ChangeEffect>();
  if (changes.length === 0 || kFrac.length === 0) return out;
  const result = computeSensitivity(base, kFrac, { keys: changes.map((c) => c.key) });
  const slopes = new Map(summariseSensitivity(result, window).map((s) => [s.key, s.maxAbsDerivative]));
  for (const c of changes) out.set(c.key, { effect: (slopes.get(c.key) ?? 0) * Math.abs(c.delta), method: "first-order" });
  const n = result.energies[0]?.length ?? 0;
  const perRow = n ** 3 * kFrac.length;
  const affordable = Math.min(opts.exactRows, Math.floor(opts.exactBudget / Math.max(1, perRow)));
  const largest = [...changes].sort((a, b) => (out.get(b.key)?.effect ?? 0) - (out.get(a.key)?.effect ?? 0)).slice(0, affordable);
  for (const c of largest) {
    const changed = computeBands(compileModel(setParameters(base, { [c.key]: c.proposed })), kFrac).energies;
    out.set(c.key, { effect: maxShiftInWindow(result.energies, changed, window), method: "exact" });
  }
  return out;
}

/** max |after − before| over bands whose before-energy lies in the window (bands paired by ascending index). */
export function maxShiftInWindow(before: ArrayLike<number>[], after: ArrayLike<number>[], window: [number, number]): number {
  let max = 0;
  before.forEach((levels, k) => {
    for (let b = 0; b < levels.length; b++) {
      const e = levels[b];
      if (e >= window[0] && e <= window[1]) max = Math.max(max, Math.abs(after[k][b] - e));
    }
  });
  return max;
}
