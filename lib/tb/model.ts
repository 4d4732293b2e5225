import { DEFAULT_SHELL_TOLERANCE } from "./document-validate";
import type { ModelDocument } from "./document-schema";
import { realToFrac, reciprocalVectors, type Vec3 } from "./lattice";
import { findBonds } from "./neighbours";
import { mirrorBondKey, type Orbital } from "./orbitals";
import { slaterKosterElement } from "./slater-koster";
import { spinOrbitEntries } from "./spin-orbit";

export interface BasisState {
  site: number;
  orbital: Orbital;
  spin: 0 | 1 | null;
}

/**
 * A document compiled for fast H(k): H_ij(k) = onsite_i δ_ij + Σ_terms t e^{2πi f·d}, where d is the term's
 * displacement in fractional lattice coordinates (R + τj − τi, or R for the cell phase).
 */
export interface CompiledModel {
  dimension: 1 | 2 | 3;
  size: number;
  orbitalLabels: string[];
  lattice: number[][];
  reciprocal: number[][];
  electronCount: number;
  blochPhase: "atomic-position" | "cell";
  basis: BasisState[];
  onsite: Float64Array;
  /** Distinct displacements, `dimension` numbers each. */
  displacements: Float64Array;
  /** Per term: matrix index row·size + col, displacement index, row, col, integer translation and value. */
  termIndex: Int32Array;
  termDisplacement: Int32Array;
  termRow: Int32Array;
  termCol: Int32Array;
  termTranslation: Int32Array;
  termRe: Float64Array;
  termIm: Float64Array;
}

const ARROWS = ["↑", "↓"];

interface Acc {
  row: number;
  col: number;
  t: number[];
  re: number;
  im: number;
}

export function compileModel(doc: ModelDocument): CompiledModel {
  const d = doc.lattice.dimension;
  const vectors = doc.lattice.vectors;
  const reciprocal = reciprocalVectors(vectors);
  const positions = doc.sites.map((s) => s.position as Vec3);
  const spinful = Object.keys(doc.spinOrbit ?? {}).length > 0;
  const first: number[] = [];
  const spatial: BasisState[] = [];
  doc.sites.forEach((site, i) => {
    first.push(spatial.length);
    for (const orbital of site.orbitals) spatial.push({ site: i, orbital, spin: null });
  });
  const nOrb = spatial.length;
  const basis: BasisState[] = spinful
    ? [0, 1].flatMap((spin) => spatial.map((b) => ({ ...b, spin: spin as 0 | 1 })))
    : spatial;
  const size = basis.length;
  const orbitalIndex = (site: number, orbital: Orbital) => first[site] + doc.sites[site].orbitals.indexOf(orbital);

  const acc = new Map<string, Acc>();
  const addRaw = (r: number, c: number, t: number[], re: number, im: number) => {
    const key = `${r},${c},${t.join(",")}`;
    const e = acc.get(key);
    if (e) {
      e.re += re;
      e.im += im;
    } else acc.set(key, { row: r, col: c, t: t.slice(), re, im });
  };
  // Spin-independent terms appear once in each spin block.
  const add = (row: number, col: number, t: number[], re: number, im: number) => {
    for (const spin of spinful ? [0, 1] : [0]) addRaw(row + spin * nOrb, col + spin * nOrb, t, re, im);
  };

  for (const shell of doc.shells) {
    const [a, b] = shell.species;
    const integral = (key: string) => shell.params[key] ?? (a === b ? shell.params[mirrorBondKey(key)] : undefined) ?? 0;
    const fromSites = doc.sites.flatMap((s, j) => (s.species === a ? [j] : []));
    const toSites = doc.sites.flatMap((s, j) => (s.species === b ? [j] : []));
    const tol = shell.tolerance ?? DEFAULT_SHELL_TOLERANCE;
    for (const bond of findBonds(vectors, reciprocal, positions, fromSites, toSites, shell.distance - tol, shell.distance + tol)) {
      const c = bond.vector.map((x) => x / bond.length) as Vec3;
      const back = bond.translation.map((x) => -x + 0);
      for (const o1 of doc.sites[bond.from].orbitals) {
        for (const o2 of doc.sites[bond.to].orbitals) {
          const v = slaterKosterElement(o1, o2, c, integral);
          if (v === 0) continue;
          const i = orbitalIndex(bond.from, o1), j = orbitalIndex(bond.to, o2);
          add(i, j, bond.translation, v, 0);
          if (a !== b) add(j, i, back, v, 0);
        }
      }
    }
  }

  const siteIndex = new Map(doc.sites.map((s, i) => [s.label, i]));
  for (const h of doc.hoppings ?? []) {
    const i = orbitalIndex(siteIndex.get(h.from.site)!, h.from.orbital);
    const j = orbitalIndex(siteIndex.get(h.to.site)!, h.to.orbital);
    const im = h.value.im ?? 0;
    add(i, j, h.translation, h.value.re, im);
    add(j, i, h.translation.map((x) => -x + 0), h.value.re, -im);
  }

  const zero = new Array<number>(d).fill(0);
  const pIndex: Record<number, Orbital> = { 0: "px", 1: "py", 2: "pz" };
  doc.sites.forEach((site, s) => {
    const lambda = doc.spinOrbit?.[site.species];
    if (lambda === undefined) return;
    for (const e of spinOrbitEntries(lambda)) {
      const r = orbitalIndex(s, pIndex[e.row.p]) + e.row.spin * nOrb;
      const c = orbitalIndex(s, pIndex[e.col.p]) + e.col.spin * nOrb;
      addRaw(r, c, zero, e.re, e.im);
    }
  });

  const siteFrac = positions.map((p) => realToFrac(reciprocal, p));
  const atomic = doc.conventions.blochPhase === "atomic-position";
  const terms = [...acc.values()].filter((e) => e.re !== 0 || e.im !== 0);
  const dispKeys = new Map<string, number>();
  const dispList: number[] = [];
  const termDisplacement = new Int32Array(terms.length);
  terms.forEach((e, n) => {
    const disp = e.t.map((x, k) => x + (atomic ? siteFrac[basis[e.col].site][k] - siteFrac[basis[e.row].site][k] : 0));
    const key = disp.map((x) => x.toFixed(10)).join(",");
    let idx = dispKeys.get(key);
    if (idx === undefined) {
      idx = dispKeys.size;
      dispKeys.set(key, idx);
      dispList.push(...disp);
    }
    termDisplacement[n] = idx;
  });

  const onsite = new Float64Array(size);
  basis.forEach((b, i) => (onsite[i] = doc.onsite[doc.sites[b.site].species][b.orbital]));
  return {
    dimension: d,
    size,
    orbitalLabels: basis.map((b) => `${doc.sites[b.site].label}:${b.orbital}${b.spin === null ? "" : ARROWS[b.spin]}`),
    lattice: vectors.map((v) => v.slice()),
    reciprocal,
    electronCount: doc.electronCount,
    blochPhase: doc.conventions.blochPhase,
    basis,
    onsite,
    displacements: Float64Array.from(dispList),
    termIndex: Int32Array.from(terms.map((e) => e.row * size + e.col)),
    termDisplacement,
    termRow: Int32Array.from(terms.map((e) => e.row)),
    termCol: Int32Array.from(terms.map((e) => e.col)),
    termTranslation: Int32Array.from(terms.flatMap((e) => e.t)),
    termRe: Float64Array.from(terms.map((e) => e.re)),
    termIm: Float64Array.from(terms.map((e) => e.im)),
  };
}
