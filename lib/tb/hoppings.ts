import { combine } from "./lattice";
import type { CompiledModel } from "./model";

export interface RealSpaceHopping {
  /** Basis labels, e.g. "X1:s", "Ga1:px↑". */
  from: string;
  to: string;
  /** Integer lattice translation of the TO orbital's cell. */
  translation: number[];
  /** R + τ_to − τ_from, Cartesian Å. */
  vector: number[];
  distance: number;
  re: number;
  im: number;
}

/**
 * The real-space hopping list H_ij(R) = ⟨i, 0|H|j, R⟩ of a compiled model, on-site energies included
 * (i = j, R = 0), both directions of every bond listed, sorted by distance then basis index.
 */
export function realSpaceHoppings(model: CompiledModel, positions: number[][]): RealSpaceHopping[] {
  const d = model.dimension;
  const out: RealSpaceHopping[] = [];
  const at = (i: number) => positions[model.basis[i].site];
  for (let i = 0; i < model.size; i++) {
    out.push({ from: model.orbitalLabels[i], to: model.orbitalLabels[i], translation: new Array(d).fill(0), vector: [0, 0, 0], distance: 0, re: model.onsite[i], im: 0 });
  }
  const rows: { h: RealSpaceHopping; row: number; col: number }[] = [];
  for (let t = 0; t < model.termRe.length; t++) {
    const row = model.termRow[t], col = model.termCol[t];
    const translation = Array.from(model.termTranslation.subarray(t * d, t * d + d));
    const shift = combine(model.lattice, translation);
    const vector = [0, 1, 2].map((c) => shift[c] + at(col)[c] - at(row)[c]);
    const distance = Math.hypot(vector[0], vector[1], vector[2]);
    const h = { from: model.orbitalLabels[row], to: model.orbitalLabels[col], translation, vector, distance, re: model.termRe[t], im: model.termIm[t] };
    rows.push({ h, row, col });
  }
  rows.sort((a, b) => a.h.distance - b.h.distance || a.row - b.row || a.col - b.col);
  return out.concat(rows.map((r) => r.h));
}
