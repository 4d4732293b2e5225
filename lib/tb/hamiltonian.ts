import type { CompiledModel } from "./model";

const TWO_PI = 2 * Math.PI;
const scratch = new WeakMap<CompiledModel, { cos: Float64Array; sin: Float64Array }>();

function phaseScratch(model: CompiledModel) {
  let s = scratch.get(model);
  if (!s) {
    const n = model.displacements.length / model.dimension;
    s = { cos: new Float64Array(n), sin: new Float64Array(n) };
    scratch.set(model, s);
  }
  return s;
}

/**
 * Writes the Bloch Hamiltonian at fractional wave vector kFrac into full row-major re/im (size² each).
 * One cos/sin per distinct displacement, then a single pass over the precomputed terms; no allocation.
 */
export function fillHamiltonian(model: CompiledModel, kFrac: ArrayLike<number>, re: Float64Array, im: Float64Array): void {
  const n = model.size;
  if (re.length < n * n || im.length < n * n) throw new Error(`fillHamiltonian: buffers need ${n * n} entries`);
  const d = model.dimension;
  const disp = model.displacements;
  const { cos, sin } = phaseScratch(model);
  const k0 = TWO_PI * kFrac[0], k1 = d > 1 ? TWO_PI * kFrac[1] : 0, k2 = d > 2 ? TWO_PI * kFrac[2] : 0;
  for (let p = 0, q = 0; p < cos.length; p++, q += d) {
    const phase = k0 * disp[q] + (d > 1 ? k1 * disp[q + 1] : 0) + (d > 2 ? k2 * disp[q + 2] : 0);
    cos[p] = Math.cos(phase);
    sin[p] = Math.sin(phase);
  }
  re.fill(0, 0, n * n);
  im.fill(0, 0, n * n);
  const onsite = model.onsite;
  for (let i = 0; i < n; i++) re[i * n + i] = onsite[i];
  const idx = model.termIndex, dIdx = model.termDisplacement, tr = model.termRe, ti = model.termIm;
  for (let t = 0; t < idx.length; t++) {
    const p = dIdx[t];
    const c = cos[p], s = sin[p], a = tr[t], b = ti[t];
    const m = idx[t];
    re[m] += a * c - b * s;
    im[m] += a * s + b * c;
  }
}
