import { dot, norm, type Vec3 } from "./lattice";

export interface Bond {
  from: number; // site index
  to: number;
  translation: number[]; // integer lattice translation of the TO site
  vector: Vec3; // R + τ_to − τ_from, Å
  length: number;
}

function translationRange(reciprocal: number[][], reach: number): number[] {
  return reciprocal.map((b) => Math.ceil((reach * norm(b)) / (2 * Math.PI)) + 1);
}

function* translations(range: number[]): Generator<number[]> {
  const d = range.length;
  const t = range.map((r) => -r);
  while (true) {
    yield t.slice();
    let i = d - 1;
    while (i >= 0 && t[i] === range[i]) {
      t[i] = -range[i];
      i--;
    }
    if (i < 0) return;
    t[i]++;
  }
}

function searchRange(reciprocal: number[][], positions: Vec3[], fromSites: number[], toSites: number[], maxLength: number): number[] {
  let maxOffset = 0;
  for (const i of fromSites) for (const j of toSites) maxOffset = Math.max(maxOffset, norm(sub(positions[j], positions[i])));
  return translationRange(reciprocal, maxLength + maxOffset);
}

/** How many site pairs `findBonds` looks at for these arguments: its cost, known before running it. */
export function bondSearchSize(reciprocal: number[][], positions: Vec3[], fromSites: number[], toSites: number[], maxLength: number): number {
  const cells = searchRange(reciprocal, positions, fromSites, toSites, maxLength).reduce((n, r) => n * (2 * r + 1), 1);
  return cells * fromSites.length * toSites.length;
}

/**
 * Every bond from a site in `fromSites` to a periodic image of a site in `toSites` whose length is
 * within [minLength, maxLength]. Self-bonds of zero length are never returned.
 */
export function findBonds(
  vectors: number[][],
  reciprocal: number[][],
  positions: Vec3[],
  fromSites: number[],
  toSites: number[],
  minLength: number,
  maxLength: number,
): Bond[] {
  const range = searchRange(reciprocal, positions, fromSites, toSites, maxLength);
  const bonds: Bond[] = [];
  for (const t of translations(range)) {
    const shift = [0, 0, 0];
    t.forEach((n, i) => {
      for (let c = 0; c < 3; c++) shift[c] += n * vectors[i][c];
    });
    for (const i of fromSites) {
      for (const j of toSites) {
        const v: Vec3 = [
          shift[0] + positions[j][0] - positions[i][0],
          shift[1] + positions[j][1] - positions[i][1],
          shift[2] + positions[j][2] - positions[i][2],
        ];
        const length = Math.sqrt(dot(v, v));
        if (length < 1e-9 || length < minLength || length > maxLength) continue;
        bonds.push({ from: i, to: j, translation: t, vector: v, length });
      }
    }
  }
  return bonds;
}

/** Distinct bond lengths (rounded to 1e-4 Å) up to `maxLength`, ascending: for error messages. */
export function distinctBondLengths(
  vectors: number[][],
  reciprocal: number[][],
  positions: Vec3[],
  fromSites: number[],
  toSites: number[],
  maxLength: number,
): number[] {
  const lengths = findBonds(vectors, reciprocal, positions, fromSites, toSites, 0, maxLength).map(
    (b) => Math.round(b.length * 1e4) / 1e4,
  );
  return [...new Set(lengths)].sort((a, b) => a - b);
}

function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
