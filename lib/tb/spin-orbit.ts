/**
 * On-site spin–orbit coupling H = λ L·S on a p shell, ħ = 1, S = σ/2, in the real basis (px, py, pz) × (↑, ↓).
 * ⟨p_i|L_k|p_j⟩ = −i ε_kij (standard angular-momentum algebra, e.g. J. J. Sakurai, Modern Quantum Mechanics,
 * ch. 3). L·S = [j(j+1) − l(l+1) − s(s+1)]/2 gives the levels +λ/2 (j = 3/2, four states) and −λ (j = 1/2, two).
 */

export interface SpinOrbitEntry {
  /** p orbital index 0..2 (x, y, z) and spin 0 (↑) / 1 (↓) of the row and the column. */
  row: { p: number; spin: number };
  col: { p: number; spin: number };
  re: number;
  im: number;
}

function levi(k: number, i: number, j: number): number {
  if (k === i || i === j || k === j) return 0;
  return (i - k + 3) % 3 === 1 ? 1 : -1;
}

/** Pauli matrices as [re, im] per element. */
const PAULI: [number, number][][][] = [
  [[[0, 0], [1, 0]], [[1, 0], [0, 0]]],
  [[[0, 0], [0, -1]], [[0, 1], [0, 0]]],
  [[[1, 0], [0, 0]], [[0, 0], [-1, 0]]],
];

/** The non-zero elements of λ L·S for one p shell. */
export function spinOrbitEntries(lambda: number): SpinOrbitEntry[] {
  const entries: SpinOrbitEntry[] = [];
  for (let i = 0; i < 3; i++) {
    for (let si = 0; si < 2; si++) {
      for (let j = 0; j < 3; j++) {
        for (let sj = 0; sj < 2; sj++) {
          let re = 0, im = 0;
          for (let k = 0; k < 3; k++) {
            const e = levi(k, i, j);
            if (e === 0) continue;
            const [pr, pi] = PAULI[k][si][sj];
            // (−i ε)(pr + i pi) = ε pi − i ε pr
            re += e * pi;
            im += -e * pr;
          }
          if (re !== 0 || im !== 0) {
            entries.push({ row: { p: i, spin: si }, col: { p: j, spin: sj }, re: (lambda / 2) * re, im: (lambda / 2) * im });
          }
        }
      }
    }
  }
  return entries;
}
