import { createEigenWorkspace, eigvalsHermitian } from "../eigen";
import { fillHamiltonian } from "../hamiltonian";
import type { CompiledModel } from "../model";
import type { EnergySolver, SpinDegeneracy } from "./constants";

/** Energy solver for a compiled model (buffers reused between calls; each call returns a fresh array). */
export function createEnergySolver(model: CompiledModel): EnergySolver {
  const n = model.size;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const ws = createEigenWorkspace(n);
  return (kFrac) => {
    fillHamiltonian(model, kFrac, re, im);
    const values = new Float64Array(n);
    eigvalsHermitian(n, re, im, values, ws);
    return values;
  };
}

/** 1 when the basis carries spin (spin–orbit on), else 2: each spatial state then holds two electrons. */
export function spinDegeneracyOf(model: CompiledModel): SpinDegeneracy {
  return model.orbitalLabels.some((l) => l.endsWith("↑") || l.endsWith("↓")) ? 1 : 2;
}

/** Monkhorst–Pack divisions giving roughly `target` k-points in the model's dimension. */
export function defaultMeshDivisions(dimension: 1 | 2 | 3, target = 4000): number[] {
  const q = Math.max(2, Math.round(target ** (1 / dimension)));
  return new Array<number>(dimension).fill(q);
}
