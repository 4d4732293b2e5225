import type { ModelDocument } from "../document";
import { fillHamiltonian } from "../hamiltonian";
import { compileModel } from "../model";
import { setParameters } from "../parameters";
import { computeBands } from "../bands";
import { LevelShiftSolver } from "./hellmann-feynman";
import { buildDerivativeModels } from "./sensitivity";

/**
 * Largest band shift a parameter change causes in an energy window (window on the unchanged bands):
 * first order Σ_p (∂E/∂p)·Δp (Hellmann–Feynman, with the combined perturbation so degenerate levels split
 * correctly) and the exact recompute with the changed document.
 */
export interface ShiftPeak {
  maxAbs: number;
  kIndex: number;
  band: number;
}

export interface ParameterChangeEffect {
  firstOrder: ShiftPeak;
  exact: ShiftPeak;
  firstOrderDelta: Float64Array[];
  exactDelta: Float64Array[];
}

export function estimateParameterChange(
  doc: ModelDocument,
  changes: Record<string, number>,
  kFrac: number[][],
  window: [number, number] = [-Infinity, Infinity],
): ParameterChangeEffect {
  const current = Object.keys(changes);
  const derivativeModels = buildDerivativeModels(doc, current);
  const deltas = derivativeModels.map((d) => changes[d.parameter.key] - d.parameter.value);
  const model = compileModel(doc);
  const n = model.size;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const dRe = new Float64Array(n * n), dIm = new Float64Array(n * n);
  const pRe = new Float64Array(n * n), pIm = new Float64Array(n * n);
  const solver = new LevelShiftSolver(n);
  const base: Float64Array[] = [];
  const firstOrderDelta = kFrac.map((k) => {
    fillHamiltonian(model, k, re, im);
    base.push(solver.diagonalise(re, im));
    dRe.fill(0);
    dIm.fill(0);
    derivativeModels.forEach((d, j) => {
      fillHamiltonian(d.model, k, pRe, pIm);
      for (let i = 0; i < n * n; i++) {
        dRe[i] += deltas[j] * pRe[i];
        dIm[i] += deltas[j] * pIm[i];
      }
    });
    const out = new Float64Array(n);
    solver.levelShifts(dRe, dIm, out);
    return out;
  });
  const changed = computeBands(compileModel(setParameters(doc, changes)), kFrac).energies;
  const exactDelta = changed.map((levels, k) => Float64Array.from(levels, (e, b) => e - base[k][b]));
  const peak = (delta: Float64Array[]): ShiftPeak => {
    const best = { maxAbs: 0, kIndex: -1, band: -1 };
    delta.forEach((row, k) =>
      row.forEach((d, b) => {
        const e = base[k][b];
        if (e >= window[0] && e <= window[1] && Math.abs(d) > best.maxAbs) Object.assign(best, { maxAbs: Math.abs(d), kIndex: k, band: b });
      }),
    );
    return best;
  };
  return { firstOrder: peak(firstOrderDelta), exact: peak(exactDelta), firstOrderDelta, exactDelta };
}
