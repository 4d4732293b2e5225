import type { ReferenceBands, ReferencePair } from "./compare-reference";
import type { BandFitOptions } from "./fit-input";

/** Energies at the reference k-points and ∂E_n/∂p_j stored as derivatives[k][n·P + j]. */
export interface FitEvaluation {
  energies: ArrayLike<number>[];
  derivatives: Float64Array[];
}

export interface WeightedPair extends ReferencePair {
  weight: number;
}

/**
 * Residuals r_i = √w_i·(E_model − E_ref − s) and their Jacobian, where the alignment shift s moves with the
 * parameters: mean model − reference for "least-squares" (weighted), model VBM − reference VBM for "vbm".
 */
export function buildResiduals(
  ev: FitEvaluation,
  pairs: WeightedPair[],
  ref: ReferenceBands,
  opts: BandFitOptions,
  parameterCount: number,
): { r: Float64Array; jac: Float64Array; shift: number } {
  const P = parameterCount;
  const { shift, shiftGradient } = alignmentShift(ev, pairs, ref, opts, P);
  const r = new Float64Array(pairs.length);
  const jac = new Float64Array(pairs.length * P);
  pairs.forEach((p, i) => {
    const sw = Math.sqrt(p.weight);
    r[i] = sw * (ev.energies[p.k][p.modelBand] - (ref.energies[p.k][p.referenceBand] as number) - shift);
    const d = ev.derivatives[p.k];
    for (let j = 0; j < P; j++) jac[i * P + j] = sw * (d[p.modelBand * P + j] - shiftGradient[j]);
  });
  return { r, jac, shift };
}

function alignmentShift(ev: FitEvaluation, pairs: WeightedPair[], ref: ReferenceBands, opts: BandFitOptions, P: number) {
  const shiftGradient = new Float64Array(P);
  if (opts.alignment === "least-squares") {
    let sw = 0;
    let s = 0;
    for (const p of pairs) {
      sw += p.weight;
      s += p.weight * (ev.energies[p.k][p.modelBand] - (ref.energies[p.k][p.referenceBand] as number));
      for (let j = 0; j < P; j++) shiftGradient[j] += p.weight * ev.derivatives[p.k][p.modelBand * P + j];
    }
    for (let j = 0; j < P; j++) shiftGradient[j] /= sw;
    return { shift: s / sw, shiftGradient };
  }
  if (opts.alignment === "vbm") {
    const band = (opts.occupiedBands as number) - 1;
    const refBand = band + (opts.bandOffset ?? 0);
    let kModel = -1;
    let refVbm = -Infinity;
    ref.energies.forEach((row, k) => {
      const e = row[refBand];
      if (e === null || e === undefined || ev.energies[k][band] === undefined) return;
      refVbm = Math.max(refVbm, e);
      if (kModel < 0 || ev.energies[k][band] > ev.energies[kModel][band]) kModel = k;
    });
    if (kModel < 0) throw new Error("fit: no valence-band values to align");
    for (let j = 0; j < P; j++) shiftGradient[j] = ev.derivatives[kModel][band * P + j];
    return { shift: ev.energies[kModel][band] - refVbm, shiftGradient };
  }
  return { shift: 0, shiftGradient };
}
