import type { ModelDocument } from "../document";
import { fillHamiltonian } from "../hamiltonian";
import { compileModel, type CompiledModel } from "../model";
import { listParameters, setParameters, type ParameterRef } from "../parameters";
import { LevelShiftSolver } from "./hellmann-feynman";

/**
 * ∂E_n(k)/∂p for document parameters by Hellmann–Feynman (hellmann-feynman.ts). H(k) is linear and homogeneous in
 * every listed parameter, so ∂H/∂p is H of the document with p = 1 and every other parameter 0: compiled once per
 * parameter and independent of the parameter values.
 */
export interface DerivativeModel {
  parameter: ParameterRef;
  model: CompiledModel;
}

export function buildDerivativeModels(doc: ModelDocument, keys?: string[]): DerivativeModel[] {
  const all = listParameters(doc);
  const chosen = keys ? keys.map((k) => all.find((p) => p.key === k) ?? fail(k)) : all;
  const zeros = Object.fromEntries(all.map((p) => [p.key, 0]));
  return chosen.map((parameter) => ({ parameter, model: compileModel(setParameters(doc, { ...zeros, [parameter.key]: 1 })) }));
}

function fail(key: string): never {
  throw new Error(`sensitivity: unknown parameter key "${key}"`);
}

export interface BandDerivatives {
  energies: Float64Array[];
  /** derivatives[k][n·P + j] = ∂E_n(k)/∂p_j (eV per unit of p_j). */
  derivatives: Float64Array[];
}

export function computeBandDerivatives(
  model: CompiledModel,
  derivativeModels: { model: CompiledModel }[],
  kFrac: ArrayLike<number>[],
  degeneracyTolerance = 1e-6,
): BandDerivatives {
  const n = model.size;
  const P = derivativeModels.length;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const dRe = new Float64Array(n * n), dIm = new Float64Array(n * n);
  const solver = new LevelShiftSolver(n, degeneracyTolerance);
  const energies: Float64Array[] = [];
  const derivatives: Float64Array[] = [];
  for (const k of kFrac) {
    fillHamiltonian(model, k, re, im);
    energies.push(solver.diagonalise(re, im));
    const out = new Float64Array(n * P);
    derivativeModels.forEach((d, j) => {
      fillHamiltonian(d.model, k, dRe, dIm);
      solver.levelShifts(dRe, dIm, out, P, j);
    });
    derivatives.push(out);
  }
  return { energies, derivatives };
}

export interface SensitivityResult extends BandDerivatives {
  parameters: ParameterRef[];
  kFrac: number[][];
}

/** ∂E_n(k)/∂p for every parameter (or the chosen keys) at the given k-points. */
export function computeSensitivity(
  doc: ModelDocument,
  kFrac: number[][],
  opts: { keys?: string[]; degeneracyTolerance?: number } = {},
): SensitivityResult {
  const derivativeModels = buildDerivativeModels(doc, opts.keys);
  const result = computeBandDerivatives(compileModel(doc), derivativeModels, kFrac, opts.degeneracyTolerance);
  return { ...result, parameters: derivativeModels.map((d) => d.parameter), kFrac };
}

/** Largest |∂E_n(k)/∂p| per parameter inside an energy window: the "sensitivity" column of a parameter diff. */
export function summariseSensitivity(result: SensitivityResult, window: [number, number] = [-Infinity, Infinity]) {
  const P = result.parameters.length;
  return result.parameters.map((parameter, j) => {
    let max = 0;
    result.energies.forEach((levels, k) => {
      levels.forEach((e, n) => {
        if (e >= window[0] && e <= window[1]) max = Math.max(max, Math.abs(result.derivatives[k][n * P + j]));
      });
    });
    return { key: parameter.key, label: parameter.label, maxAbsDerivative: max };
  });
}
