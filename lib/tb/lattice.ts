/** Lattice geometry. Vectors are rows of Cartesian 3-vectors; a d-dimensional lattice has d rows. */

export type Vec3 = [number, number, number];

export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function norm(a: ArrayLike<number>): number {
  return Math.sqrt(dot(a, a));
}

/** Inverse of a small symmetric positive-definite matrix (1×1 to 3×3), by cofactors. */
function invertSmall(m: number[][]): number[][] {
  const d = m.length;
  if (d === 1) return [[1 / m[0][0]]];
  if (d === 2) {
    const det = m[0][0] * m[1][1] - m[0][1] * m[1][0];
    return [
      [m[1][1] / det, -m[0][1] / det],
      [-m[1][0] / det, m[0][0] / det],
    ];
  }
  const c = (i: number, j: number) => {
    const r = [0, 1, 2].filter((x) => x !== i);
    const k = [0, 1, 2].filter((x) => x !== j);
    return m[r[0]][k[0]] * m[r[1]][k[1]] - m[r[0]][k[1]] * m[r[1]][k[0]];
  };
  const det = m[0][0] * c(0, 0) - m[0][1] * c(0, 1) + m[0][2] * c(0, 2);
  return [0, 1, 2].map((i) => [0, 1, 2].map((j) => (((i + j) % 2 === 0 ? 1 : -1) * c(j, i)) / det));
}

export function metric(vectors: number[][]): number[][] {
  return vectors.map((a) => vectors.map((b) => dot(a, b)));
}

/** Volume (length, area) spanned by the vectors: sqrt(det G). Zero for linearly dependent vectors. */
export function cellMeasure(vectors: number[][]): number {
  const g = metric(vectors);
  if (g.length === 1) return Math.sqrt(g[0][0]);
  if (g.length === 2) return Math.sqrt(Math.max(0, g[0][0] * g[1][1] - g[0][1] * g[1][0]));
  const det =
    g[0][0] * (g[1][1] * g[2][2] - g[1][2] * g[2][1]) -
    g[0][1] * (g[1][0] * g[2][2] - g[1][2] * g[2][0]) +
    g[0][2] * (g[1][0] * g[2][1] - g[1][1] * g[2][0]);
  return Math.sqrt(Math.max(0, det));
}

/** Reciprocal vectors b_i with a_i·b_j = 2π δ_ij, lying in the span of the a_i: B = 2π G⁻¹ A. */
export function reciprocalVectors(vectors: number[][]): number[][] {
  const ginv = invertSmall(metric(vectors));
  return ginv.map((row) => {
    const b = [0, 0, 0];
    row.forEach((g, j) => {
      for (let c = 0; c < 3; c++) b[c] += 2 * Math.PI * g * vectors[j][c];
    });
    return b;
  });
}

/** Σ f_i v_i for fractional coordinates f over the rows v_i. */
export function combine(rows: number[][], frac: ArrayLike<number>): number[] {
  const out = [0, 0, 0];
  rows.forEach((v, i) => {
    for (let c = 0; c < 3; c++) out[c] += frac[i] * v[c];
  });
  return out;
}

/** Fractional coordinates of a Cartesian point projected onto the lattice span (x·b_i / 2π). */
export function realToFrac(reciprocal: number[][], r: ArrayLike<number>): number[] {
  return reciprocal.map((b) => dot(b, r) / (2 * Math.PI));
}

/** Fractional coordinates of a Cartesian wave vector in the reciprocal basis (k·a_i / 2π). */
export function kCartToFrac(vectors: number[][], k: ArrayLike<number>): number[] {
  return vectors.map((a) => dot(a, k) / (2 * Math.PI));
}
