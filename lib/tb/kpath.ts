import type { KPathSpec, ModelDocument } from "./document-schema";
import { matchStandardLattice, STANDARD_PATHS } from "./kpath-standard";
import { combine, kCartToFrac, norm, reciprocalVectors } from "./lattice";

export interface SampledPath {
  kFrac: number[][];
  /** Cumulative path length, 1/Å; a break between runs ("U|X") adds no length. */
  distance: number[];
  /** One tick per high-symmetry point; at a break the two points share a distance. */
  ticks: { index: number; label: string }[];
}

export interface PathSpec {
  points: Record<string, number[]>;
  segments: string[][];
}

export const DEFAULT_PATH_POINTS = 200;

/** Resolves the document's path into labelled fractional points in the document's reciprocal basis. */
export function resolvePath(vectors: number[][], spec: KPathSpec): PathSpec {
  if (spec.type === "custom") return { points: spec.points, segments: spec.segments };
  const standard = STANDARD_PATHS[spec.lattice];
  const m = matchStandardLattice(spec.lattice, vectors);
  if (!m) throw new Error(`lattice vectors do not form a ${spec.lattice} lattice`);
  const points: Record<string, number[]> = {};
  for (const [label, f] of Object.entries(standard.points)) {
    // "+ 0" turns −0 into 0 so canonical output never shows "-0"
    points[label] = m.map((row) => row.reduce((s, x, j) => s + x * f[j], 0) + 0);
  }
  return { points, segments: standard.segments };
}

function allocate(lengths: number[], intervals: number): number[] {
  const total = lengths.reduce((a, b) => a + b, 0);
  const spare = Math.max(0, intervals - lengths.length);
  const raw = lengths.map((l) => (total > 0 ? (l / total) * spare : spare / lengths.length));
  const counts = raw.map((r) => 1 + Math.floor(r));
  let left = lengths.length + spare - counts.reduce((a, b) => a + b, 0);
  const order = raw.map((r, i) => [r - Math.floor(r), i]).sort((a, b) => b[0] - a[0] || a[1] - b[1]);
  for (let i = 0; left > 0; i = (i + 1) % order.length, left--) counts[order[i][1]]++;
  return counts;
}

/** Samples labelled runs of points into about `pointsTotal` k-points, spaced evenly in Cartesian length. */
export function sampleLabelledPath(vectors: number[][], path: PathSpec, pointsTotal = DEFAULT_PATH_POINTS): SampledPath {
  const reciprocal = reciprocalVectors(vectors);
  const at = (label: string) => {
    const p = path.points[label];
    if (!p) throw new Error(`path label "${label}" has no point`);
    return p;
  };
  const legs = path.segments.flatMap((run) => run.slice(1).map((label, i) => [run[i], label] as const));
  const lengths = legs.map(([a, b]) => {
    const fa = at(a), fb = at(b);
    return norm(combine(reciprocal, fa.map((x, i) => fb[i] - x)));
  });
  const counts = allocate(lengths, pointsTotal - path.segments.length);
  const out: SampledPath = { kFrac: [], distance: [], ticks: [] };
  let leg = 0, dist = 0;
  for (const run of path.segments) {
    for (let r = 0; r + 1 < run.length; r++, leg++) {
      const fa = at(run[r]), fb = at(run[r + 1]);
      out.ticks.push({ index: out.kFrac.length, label: run[r] });
      for (let s = 0; s < counts[leg]; s++) {
        const t = s / counts[leg];
        out.kFrac.push(fa.map((x, i) => x + t * (fb[i] - x)));
        out.distance.push(dist + t * lengths[leg]);
      }
      dist += lengths[leg];
    }
    out.ticks.push({ index: out.kFrac.length, label: run[run.length - 1] });
    out.kFrac.push(at(run[run.length - 1]).slice());
    out.distance.push(dist);
  }
  return out;
}

/** The document's default path, sampled into about `pointsTotal` points (default: the document's or 200). */
export function samplePath(doc: ModelDocument, pointsTotal?: number): SampledPath {
  const vectors = doc.lattice.vectors;
  return sampleLabelledPath(vectors, resolvePath(vectors, doc.kPath), pointsTotal ?? doc.kPath.pointsTotal ?? DEFAULT_PATH_POINTS);
}

interface HasReciprocal {
  lattice: number[][];
  reciprocal: number[][];
}

/** Cartesian wave vector (1/Å, 2π included) of a fractional one. */
export function fracToCart(model: HasReciprocal, kFrac: ArrayLike<number>): number[] {
  return combine(model.reciprocal, kFrac);
}

/** Fractional coordinates of a Cartesian wave vector (its component outside the lattice span is dropped). */
export function cartToFrac(model: HasReciprocal, kCart: ArrayLike<number>): number[] {
  return kCartToFrac(model.lattice, kCart);
}
