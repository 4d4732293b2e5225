import type { ModelDocument } from "@/lib/tb/document-schema";
import { resolvePath } from "@/lib/tb/kpath";
import { combine, dot, norm, reciprocalVectors } from "@/lib/tb/lattice";

/** One straight leg of the default path, measured as `samplePath` measures it (1/Å, 2π included). */
export interface PathLeg {
  from: number[];
  to: number[];
  labels: [string, string];
  /** Cumulative distance at `from`. */
  start: number;
  length: number;
  run: number;
  /** Cartesian to − from. */
  delta: number[];
}

export interface PathGeometry {
  legs: PathLeg[];
  total: number;
  reciprocal: number[][];
  /** Distances closer than this are the same place on the path: 1e-6 of its length, so six significant digits in a file suffice. */
  tolerance: number;
}

/** The document's default path as legs with their distances, summed in the same order as `samplePath` sums them. */
export function pathGeometry(doc: ModelDocument): PathGeometry {
  const vectors = doc.lattice.vectors;
  const path = resolvePath(vectors, doc.kPath);
  const reciprocal = reciprocalVectors(vectors);
  const legs: PathLeg[] = [];
  let dist = 0;
  path.segments.forEach((labels, run) => {
    for (let r = 0; r + 1 < labels.length; r++) {
      const from = path.points[labels[r]], to = path.points[labels[r + 1]];
      const delta = combine(reciprocal, to.map((x, i) => x - from[i]));
      const length = norm(delta);
      legs.push({ from, to, labels: [labels[r], labels[r + 1]], start: dist, length, run, delta });
      dist += length;
    }
  });
  return { legs, total: dist, reciprocal, tolerance: dist > 0 ? 1e-6 * dist : 1e-12 };
}

function lerp(leg: PathLeg, t: number): number[] {
  return leg.from.map((x, i) => x + t * (leg.to[i] - x));
}

/** The fractional point at distance d; where the path jumps, the end of the run before the jump. */
export function pointAtDistance(geo: PathGeometry, d: number): number[] | null {
  if (d > geo.total + geo.tolerance || geo.legs.length === 0) return null;
  let i = geo.legs.findIndex((l) => d <= l.start + l.length);
  if (i < 0) i = geo.legs.length - 1;
  const startsRun = i > 0 && geo.legs[i].run !== geo.legs[i - 1].run;
  if (startsRun && d - geo.legs[i].start <= geo.tolerance) return geo.legs[i - 1].to.slice();
  const leg = geo.legs[i];
  const t = leg.length > 0 ? Math.min(1, Math.max(0, (d - leg.start) / leg.length)) : 0;
  return lerp(leg, t);
}

/** The first leg of a run that starts at distance d (where the path jumps), or null when no run starts there. */
export function runStartAt(geo: PathGeometry, d: number): PathLeg | null {
  return geo.legs.find((l, i) => i > 0 && l.run !== geo.legs[i - 1].run && Math.abs(l.start - d) <= geo.tolerance) ?? null;
}

/** Labels of the places where the path jumps, e.g. ["K|U"]. */
export function jumpLabels(geo: PathGeometry): string[] {
  return geo.legs.flatMap((l, i) => (i > 0 && l.run !== geo.legs[i - 1].run ? [`${geo.legs[i - 1].labels[1]}|${l.labels[0]}`] : []));
}

/**
 * Distances of fractional points that follow the path in order (a point may sit anywhere on a leg), or null when
 * one of them is off the path: then the caller measures the points' own polyline instead.
 */
export function distancesAlongPath(geo: PathGeometry, points: number[][]): number[] | null {
  const out: number[] = [];
  let legIndex = 0, tMin = 0;
  for (const p of points) {
    let found = false;
    for (let j = legIndex; j < geo.legs.length && !found; j++) {
      const leg = geo.legs[j];
      const v = combine(geo.reciprocal, p.map((x, i) => x - leg.from[i]));
      const len2 = leg.length * leg.length;
      const t = len2 > 0 ? dot(v, leg.delta) / len2 : 0;
      const off = norm(v.map((x, c) => x - t * leg.delta[c]));
      const slack = leg.length > 0 ? geo.tolerance / leg.length : 0;
      if (off > geo.tolerance || t < -slack || t > 1 + slack || (j === legIndex && t < tMin - slack)) continue;
      const tc = Math.min(1, Math.max(0, t));
      out.push(leg.start + tc * leg.length);
      legIndex = j;
      tMin = tc;
      found = true;
    }
    if (!found) return null;
  }
  return out;
}

/** Cumulative Cartesian length of the polyline through the points (1/Å). */
export function polylineDistances(reciprocal: number[][], points: number[][]): number[] {
  const out = [0];
  for (let i = 1; i < points.length; i++) {
    out.push(out[i - 1] + norm(combine(reciprocal, points[i].map((x, c) => x - points[i - 1][c]))));
  }
  return out;
}
