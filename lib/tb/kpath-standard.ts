/**
 * Standard high-symmetry points and paths. Three-dimensional lattices follow W. Setyawan and S. Curtarolo,
 * Comput. Mater. Sci. 49, 299 (2010): CUB, FCC, BCC, TET and HEX (used here for "hcp") with their primitive
 * vectors and paths. Two-dimensional lattices use the kz = 0 sections of their TET (square), ORC (rectangular)
 * and HEX (hexagonal) cases; the chain runs Γ–X. The document's own primitive vectors may differ from the
 * reference ones by a unimodular integer change of basis and a rotation; `matchStandardLattice` finds that
 * change of basis so the points are expressed in the document's reciprocal basis.
 */
import type { StandardLattice } from "./document-schema";
import { cellMeasure, metric } from "./lattice";

interface StandardPath {
  dimension: 1 | 2 | 3;
  /** Reference primitive vectors for lattice parameters a and c (c unused in cubic and 2D cases; b for rectangular). */
  vectors: (a: number, c: number) => number[][];
  /** Reference parameters (a, c) consistent with a measured cell volume and a candidate short length. */
  params: (measure: number, shortLength: number) => [number, number];
  points: Record<string, number[]>;
  segments: string[][];
}

const G = "Γ";
const R3 = Math.sqrt(3);

export const STANDARD_PATHS: Record<StandardLattice, StandardPath> = {
  chain: {
    dimension: 1,
    vectors: (a) => [[a, 0, 0]],
    params: (m) => [m, 0],
    points: { [G]: [0], X: [0.5] },
    segments: [[G, "X"]],
  },
  square: {
    dimension: 2,
    vectors: (a) => [[a, 0, 0], [0, a, 0]],
    params: (m) => [Math.sqrt(m), 0],
    points: { [G]: [0, 0], X: [0, 0.5], M: [0.5, 0.5] },
    segments: [[G, "X", "M", G]],
  },
  rectangular: {
    dimension: 2,
    vectors: (a, b) => [[a, 0, 0], [0, b, 0]],
    params: (m, s) => [s, m / s],
    points: { [G]: [0, 0], X: [0.5, 0], S: [0.5, 0.5], Y: [0, 0.5] },
    segments: [[G, "X", "S", "Y", G, "S"]],
  },
  hexagonal: {
    dimension: 2,
    vectors: (a) => [[a / 2, (-a * R3) / 2, 0], [a / 2, (a * R3) / 2, 0]],
    params: (m) => [Math.sqrt((2 * m) / R3), 0],
    points: { [G]: [0, 0], M: [0.5, 0], K: [1 / 3, 1 / 3] },
    segments: [[G, "M", "K", G]],
  },
  cubic: {
    dimension: 3,
    vectors: (a) => [[a, 0, 0], [0, a, 0], [0, 0, a]],
    params: (m) => [Math.cbrt(m), 0],
    points: { [G]: [0, 0, 0], X: [0, 0.5, 0], M: [0.5, 0.5, 0], R: [0.5, 0.5, 0.5] },
    segments: [[G, "X", "M", G, "R", "X"], ["M", "R"]],
  },
  fcc: {
    dimension: 3,
    vectors: (a) => [[0, a / 2, a / 2], [a / 2, 0, a / 2], [a / 2, a / 2, 0]],
    params: (m) => [Math.cbrt(4 * m), 0],
    points: {
      [G]: [0, 0, 0], K: [3 / 8, 3 / 8, 3 / 4], L: [0.5, 0.5, 0.5], U: [5 / 8, 1 / 4, 5 / 8], W: [0.5, 0.25, 0.75], X: [0.5, 0, 0.5],
    },
    segments: [[G, "X", "W", "K", G, "L", "U", "W", "L", "K"], ["U", "X"]],
  },
  bcc: {
    dimension: 3,
    vectors: (a) => [[-a / 2, a / 2, a / 2], [a / 2, -a / 2, a / 2], [a / 2, a / 2, -a / 2]],
    params: (m) => [Math.cbrt(2 * m), 0],
    points: { [G]: [0, 0, 0], H: [0.5, -0.5, 0.5], P: [0.25, 0.25, 0.25], N: [0, 0, 0.5] },
    segments: [[G, "H", "N", G, "P", "H"], ["P", "N"]],
  },
  tetragonal: {
    dimension: 3,
    vectors: (a, c) => [[a, 0, 0], [0, a, 0], [0, 0, c]],
    params: (m, s) => [s, m / (s * s)],
    points: { [G]: [0, 0, 0], A: [0.5, 0.5, 0.5], M: [0.5, 0.5, 0], R: [0, 0.5, 0.5], X: [0, 0.5, 0], Z: [0, 0, 0.5] },
    segments: [[G, "X", "M", G, "Z", "R", "A", "Z"], ["X", "R"], ["M", "A"]],
  },
  hcp: {
    dimension: 3,
    vectors: (a, c) => [[a / 2, (-a * R3) / 2, 0], [a / 2, (a * R3) / 2, 0], [0, 0, c]],
    params: (m, s) => [s, m / ((R3 / 2) * s * s)],
    points: { [G]: [0, 0, 0], A: [0, 0, 0.5], H: [1 / 3, 1 / 3, 0.5], K: [1 / 3, 1 / 3, 0], L: [0.5, 0, 0.5], M: [0.5, 0, 0] },
    segments: [[G, "M", "K", G, "A", "L", "H", "A"], ["L", "M"], ["K", "H"]],
  },
};

function* integerMatrices(d: number, bound: number): Generator<number[][]> {
  const count = (2 * bound + 1) ** (d * d);
  for (let code = 0; code < count; code++) {
    let c = code;
    const m: number[][] = [];
    for (let i = 0; i < d; i++) {
      const row: number[] = [];
      for (let j = 0; j < d; j++) {
        row.push((c % (2 * bound + 1)) - bound);
        c = Math.floor(c / (2 * bound + 1));
      }
      m.push(row);
    }
    yield m;
  }
}

function shortLengths(vectors: number[][]): number[] {
  const d = vectors.length;
  const lengths: number[] = [];
  for (let code = 0; code < 3 ** d; code++) {
    const coeff = [0, 1, 2].slice(0, d).map((i) => (Math.floor(code / 3 ** i) % 3) - 1);
    if (coeff.every((x) => x === 0)) continue;
    const v = [0, 1, 2].map((c) => coeff.reduce((s, n, i) => s + n * vectors[i][c], 0));
    lengths.push(Math.hypot(v[0], v[1], v[2]));
  }
  return [...new Set(lengths.map((l) => Math.round(l * 1e6) / 1e6))].sort((a, b) => a - b);
}

/**
 * The integer matrix M with a_doc,i = Σ_j M_ij a_ref,j (up to a rotation), or null when the document's lattice
 * is not of the given type. Fractional k-points map as f_doc = M f_ref.
 */
export function matchStandardLattice(type: StandardLattice, vectors: number[][], relTol = 1e-3): number[][] | null {
  const spec = STANDARD_PATHS[type];
  const d = vectors.length;
  if (d !== spec.dimension) return null;
  const gDoc = metric(vectors);
  const scale = Math.max(...gDoc.map((row, i) => row[i]));
  for (const s of shortLengths(vectors)) {
    const [a, c] = spec.params(cellMeasure(vectors), s);
    const gRef = metric(spec.vectors(a, c));
    for (const m of integerMatrices(d, d === 3 ? 1 : 2)) {
      let ok = true;
      for (let i = 0; i < d && ok; i++) {
        for (let j = 0; j < d && ok; j++) {
          let g = 0;
          for (let p = 0; p < d; p++) for (let q = 0; q < d; q++) g += m[i][p] * gRef[p][q] * m[j][q];
          ok = Math.abs(g - gDoc[i][j]) <= relTol * scale;
        }
      }
      if (ok) return m;
    }
  }
  return null;
}
