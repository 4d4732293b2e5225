/**
 * An independent Bloch Hamiltonian of the nearest-neighbour sp3s* model in the diamond/zinc-blende structure, written
 * out element by element as in P. Vogl, H. P. Hjalmarson and J. D. Dow, J. Phys. Chem. Solids 44, 365 (1983), Table A
 * (the matrix with the phase sums g0…g3 over the four bonds d = (a/4)(±1, ±1, ±1)); from memory. It shares no code
 * with lib/tb: eigenvalues come from ml-matrix on the real symmetric embedding [[Re H, −Im H], [Im H, Re H]], whose
 * spectrum is that of H with every level twice.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";

export interface VoglMatrixParameters {
  a: number;
  esA: number; epA: number; esC: number; epC: number; essA: number; essC: number;
  vss: number; vxx: number; vxy: number; vsapc: number; vpasc: number; vssapc: number; vpassc: number;
}

type C = [number, number];
const mul = (z: C, s: number): C => [z[0] * s, z[1] * s];
const conj = (z: C): C => [z[0], -z[1]];

/** Eigenvalues (ascending) at a fractional k in the basis of the fcc reciprocal vectors (2π/a)(−1,1,1), (1,−1,1), (1,1,−1). */
export function voglLevels(p: VoglMatrixParameters, kFrac: number[]): number[] {
  const f = (2 * Math.PI) / p.a;
  const b = [[-f, f, f], [f, -f, f], [f, f, -f]];
  const k = [0, 1, 2].map((c) => kFrac[0] * b[0][c] + kFrac[1] * b[1][c] + kFrac[2] * b[2][c]);
  const bonds = [[1, 1, 1], [1, -1, -1], [-1, 1, -1], [-1, -1, 1]].map((d) => d.map((x) => (x * p.a) / 4));
  const e = bonds.map((d): C => {
    const phase = k[0] * d[0] + k[1] * d[1] + k[2] * d[2];
    return [Math.cos(phase), Math.sin(phase)];
  });
  const sum = (signs: number[]): C => [0, 1].map((r) => 0.25 * signs.reduce((s, sg, i) => s + sg * e[i][r], 0)) as C;
  const g0 = sum([1, 1, 1, 1]);
  const g = [sum([1, 1, -1, -1]), sum([1, -1, 1, -1]), sum([1, -1, -1, 1])];
  // basis: 0 s_a, 1 s_c, 2–4 p_a (x, y, z), 5–7 p_c, 8 s*_a, 9 s*_c; anion rows, cation columns
  const n = 10;
  const h: C[][] = Array.from({ length: n }, () => Array.from({ length: n }, (): C => [0, 0]));
  const set = (i: number, j: number, z: C) => ((h[i][j] = z), (h[j][i] = conj(z)));
  [p.esA, p.esC, p.epA, p.epA, p.epA, p.epC, p.epC, p.epC, p.essA, p.essC].forEach((d, i) => (h[i][i] = [d, 0]));
  set(0, 1, mul(g0, p.vss));
  for (let c = 0; c < 3; c++) {
    set(0, 5 + c, mul(g[c], p.vsapc));
    set(2 + c, 1, mul(g[c], -p.vpasc));
    set(8, 5 + c, mul(g[c], p.vssapc));
    set(2 + c, 9, mul(g[c], -p.vpassc));
    set(2 + c, 5 + c, mul(g0, p.vxx));
  }
  // ⟨x_a|H|y_c⟩ = V(x,y) g3, ⟨x_a|H|z_c⟩ = V(x,y) g2, ⟨y_a|H|z_c⟩ = V(x,y) g1, and the same with a and c exchanged
  const pairs: [number, number, number][] = [[0, 1, 2], [0, 2, 1], [1, 2, 0]];
  for (const [x, y, gi] of pairs) {
    set(2 + x, 5 + y, mul(g[gi], p.vxy));
    set(2 + y, 5 + x, mul(g[gi], p.vxy));
  }
  const real = Matrix.zeros(2 * n, 2 * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      real.set(i, j, h[i][j][0]);
      real.set(i + n, j + n, h[i][j][0]);
      real.set(i, j + n, -h[i][j][1]);
      real.set(i + n, j, h[i][j][1]);
    }
  }
  const values = new EigenvalueDecomposition(real, { assumeSymmetric: true }).realEigenvalues.sort((x, y) => x - y);
  return values.filter((_, i) => i % 2 === 0);
}

/** Gap from `occupied` filled bands over the given k-points: value and whether both edges sit at one k-point. */
export function voglGap(p: VoglMatrixParameters, kFrac: number[][], occupied: number): { value: number; direct: boolean; vbmK: number; cbmK: number } {
  let vbmK = 0;
  let cbmK = 0;
  const levels = kFrac.map((k) => voglLevels(p, k));
  levels.forEach((l, i) => {
    if (l[occupied - 1] > levels[vbmK][occupied - 1]) vbmK = i;
    if (l[occupied] < levels[cbmK][occupied]) cbmK = i;
  });
  const value = levels[cbmK][occupied] - levels[vbmK][occupied - 1];
  const same = kFrac[vbmK].every((x, c) => Math.abs(x - kFrac[cbmK][c]) < 1e-9);
  return { value, direct: same, vbmK, cbmK };
}
