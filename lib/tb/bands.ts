import { createEigenWorkspace, eigHermitian, eigvalsHermitian } from "./eigen";
import { fillHamiltonianLower } from "./hamiltonian";
import type { CompiledModel } from "./model";

export interface BandResult {
  /** Per k-point, all eigenvalues ascending, eV. */
  energies: Float64Array[];
  /** Per k-point, row-major size×size; column j is the eigenvector of energies[k][j]. */
  vectors?: { re: Float64Array; im: Float64Array }[];
}

/** Eigenvalues (and optionally eigenvectors) of H(k) at each fractional k-point. */
export function computeBands(model: CompiledModel, kFrac: ArrayLike<number>[], opts: { vectors?: boolean } = {}): BandResult {
  const n = model.size;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const ws = createEigenWorkspace(n);
  const energies: Float64Array[] = [];
  const vectors: { re: Float64Array; im: Float64Array }[] = [];
  for (const k of kFrac) {
    fillHamiltonianLower(model, k, re, im);
    const values = new Float64Array(n);
    if (opts.vectors) {
      const v = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
      eigHermitian(n, re, im, values, v.re, v.im, ws);
      vectors.push(v);
    } else {
      eigvalsHermitian(n, re, im, values, ws);
    }
    energies.push(values);
  }
  return opts.vectors ? { energies, vectors } : { energies };
}

/**
 * Eigenvalues only, written into one flat array (k-major, `size` per k-point): the allocation-free path used
 * by the benchmark and the worker threads. `kFlat` holds `dimension` numbers per k-point; only k-points
 * first..end−1 are solved (all by default), each written at its own place in `out`.
 */
export function computeEnergiesFlat(
  model: CompiledModel, kFlat: Float64Array, out: Float64Array, first = 0, end = kFlat.length / model.dimension,
): void {
  const n = model.size, d = model.dimension;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const ws = createEigenWorkspace(n);
  const values = new Float64Array(n);
  for (let k = first; k < end; k++) {
    fillHamiltonianLower(model, kFlat, re, im, k * d);
    eigvalsHermitian(n, re, im, values, ws);
    out.set(values, k * n);
  }
}

/**
 * Orbital character |ψ_j(orbital i)|² per k-point: weights[k][j * size + i], summing to 1 over i for each band j.
 */
export function orbitalCharacter(model: CompiledModel, result: BandResult): Float64Array[] {
  if (!result.vectors) throw new Error("orbitalCharacter needs eigenvectors: call computeBands with { vectors: true }");
  const n = model.size;
  return result.vectors.map(({ re, im }) => {
    const w = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) w[j * n + i] = re[i * n + j] ** 2 + im[i * n + j] ** 2;
    }
    return w;
  });
}
