/**
 * Fractional ↔ Cartesian k for reciprocal vectors given as rows (1/Å, 2π included).
 * Kept here (rather than the core's helpers) so the analysis works on plain band models too;
 * rows may have more components than the lattice dimension (e.g. a chain embedded in 3D).
 */
export function kFracToCart(reciprocal: number[][], kFrac: ArrayLike<number>): number[] {
  const m = reciprocal[0].length;
  const out = new Array<number>(m).fill(0);
  for (let i = 0; i < reciprocal.length; i++) {
    for (let c = 0; c < m; c++) out[c] += (kFrac[i] ?? 0) * reciprocal[i][c];
  }
  return out;
}

/** Least-squares inverse of kFracToCart: components outside the span of the rows are dropped. */
export function kCartToFrac(reciprocal: number[][], kCart: ArrayLike<number>): number[] {
  const gram = reciprocal.map((a) => reciprocal.map((b) => dot(a, b)));
  const rhs = reciprocal.map((a) => dot(a, kCart));
  return solveSmall(gram, rhs);
}

export function kLength(reciprocal: number[][], kFrac: ArrayLike<number>): number {
  return Math.hypot(...kFracToCart(reciprocal, kFrac));
}

function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * (b[i] ?? 0);
  return s;
}

/** Gaussian elimination with partial pivoting for the tiny (≤3×3) Gram systems above. */
function solveSmall(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (Math.abs(m[p][c]) < 1e-300) throw new Error("k-geometry: reciprocal vectors are linearly dependent");
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  return m.map((row, i) => row[n] / row[i]);
}
