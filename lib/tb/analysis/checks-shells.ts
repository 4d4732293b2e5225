import { computeBands } from "../bands";
import type { ModelDocument } from "../document";
import { compileModel } from "../model";
import type { CheckResult } from "./check-result";

/**
 * Two-centre integrals should fall off with distance (common practice: overlap of atomic orbitals decays
 * roughly exponentially, e.g. Harrison, Electronic Structure and the Properties of Solids (1980), ch. 2):
 * warn when, for a species pair, a farther shell's largest |integral| exceeds a nearer shell's.
 */
export function checkHoppingDecay(doc: ModelDocument): CheckResult {
  const byPair = new Map<string, { distance: number; index: number; max: number }[]>();
  for (const s of doc.shells) {
    const pair = [...s.species].sort().join("–");
    const max = Math.max(0, ...Object.values(s.params).map(Math.abs));
    byPair.set(pair, [...(byPair.get(pair) ?? []), { distance: s.distance, index: s.index, max }]);
  }
  const problems: string[] = [];
  let worstRatio = 0;
  for (const [pair, shells] of byPair) {
    shells.sort((a, b) => a.distance - b.distance);
    for (let i = 1; i < shells.length; i++) {
      const nearer = Math.max(...shells.slice(0, i).map((s) => s.max));
      const ratio = nearer > 0 ? shells[i].max / nearer : shells[i].max > 0 ? Infinity : 0;
      worstRatio = Math.max(worstRatio, ratio);
      if (ratio > 1) problems.push(`${pair} shell ${shells[i].index} (${shells[i].distance} Å): largest |integral| ${shells[i].max} eV exceeds ${nearer} eV of a nearer shell`);
    }
  }
  return {
    id: "hopping-decay",
    title: "Integrals decay with distance",
    status: problems.length === 0 ? "pass" : "warn",
    detail: problems.length === 0 ? "every farther shell is weaker than the nearer ones" : problems.join("; "),
    measured: worstRatio,
  };
}

/** The document without its outermost shell(s) (largest distance), or null when that would leave no shell. */
export function withoutOutermostShell(doc: ModelDocument): ModelDocument | null {
  if (doc.shells.length < 2) return null;
  const far = Math.max(...doc.shells.map((s) => s.distance));
  const shells = doc.shells.filter((s) => s.distance < far - 1e-9);
  return shells.length > 0 ? { ...doc, shells } : null;
}

/**
 * Largest band shift on the given k-points when the outermost shell is dropped, counted where the full model's
 * level lies in the window. Informational; a warning above `warnAbove` (default 0.5 eV, common practice).
 */
export function checkOutermostShell(doc: ModelDocument, kFrac: number[][], window: [number, number] = [-Infinity, Infinity], warnAbove = 0.5): CheckResult {
  const reduced = withoutOutermostShell(doc);
  const id = "outermost-shell";
  const title = "Effect of dropping the outermost shell";
  if (!reduced) return { id, title, status: "pass", detail: "only one shell distance: nothing to drop", measured: null };
  const full = computeBands(compileModel(doc), kFrac).energies;
  const cut = computeBands(compileModel(reduced), kFrac).energies;
  let worst = 0;
  let where = "";
  full.forEach((levels, k) =>
    levels.forEach((e, n) => {
      const d = Math.abs(e - cut[k][n]);
      if (e >= window[0] && e <= window[1] && d > worst) {
        worst = d;
        where = `band ${n} at k = (${kFrac[k].map((x) => x.toFixed(3)).join(", ")})`;
      }
    }),
  );
  const far = Math.max(...doc.shells.map((s) => s.distance));
  return {
    id,
    title,
    status: worst > warnAbove ? "warn" : "pass",
    detail: `dropping the shell(s) at ${far} Å moves the bands by up to ${worst.toFixed(4)} eV${where ? ` (${where})` : ""}`,
    measured: worst,
  };
}
