import type { ModelDocument } from "@/lib/tb/document-schema";
import { samplePath } from "@/lib/tb/kpath";
import { reciprocalVectors } from "@/lib/tb/lattice";
import { issueAt, pointRef } from "./k-checks";
import { distancesAlongPath, jumpLabels, pathGeometry, pointAtDistance, polylineDistances, runStartAt } from "./path-geometry";
import { IssueList, ReferenceBandsError, type KSource, type ParsedReferenceBands } from "./types";

export interface ResolvedReferenceBands {
  /** Fractional k-points in the document's reciprocal basis: evaluate the model here. */
  kFrac: number[][];
  /** eV, one row per k-point. */
  energies: (number | null)[][];
  /** Position along the default path (1/Å), for plotting over the model's bands. */
  distance: number[];
}

function sourcesOf(parsed: ParsedReferenceBands): KSource[] {
  return parsed.kSources ?? parsed.k.map((_, i) => ({ where: `point ${i + 1}` }));
}

function resolveIndices(doc: ModelDocument, parsed: ParsedReferenceBands, sources: KSource[], issues: IssueList, pointsTotal?: number) {
  const path = samplePath(doc, pointsTotal);
  const n = path.kFrac.length;
  const kFrac: number[][] = [], distance: number[] = [];
  parsed.k.forEach(([i], p) => {
    if (!Number.isInteger(i) || i < 0 || i >= n) {
      issues.add(issueAt(sources[p], `k outside the path: index ${i} is not among the path's ${n} points (0–${n - 1})`));
      return;
    }
    kFrac.push(path.kFrac[i].slice());
    distance.push(path.distance[i]);
  });
  return { kFrac, distance };
}

function resolveDistances(doc: ModelDocument, parsed: ParsedReferenceBands, sources: KSource[], issues: IssueList) {
  const geo = pathGeometry(doc);
  const kFrac: number[][] = [], distance: number[] = [];
  parsed.k.forEach(([d], p) => {
    const repeat = p > 0 && parsed.k[p - 1][0] === d;
    if (repeat) {
      const run = runStartAt(geo, d);
      if (!run) {
        const jumps = jumpLabels(geo);
        const where = jumps.length > 0 ? `it jumps only at ${jumps.join(", ")}` : "it has no jumps";
        issues.add(issueAt(sources[p], `duplicate k: distance ${d} repeats ${pointRef(sources[p - 1])}, and a distance may repeat only where the path jumps (${where})`));
        return;
      }
      kFrac.push(run.from.slice());
      distance.push(d);
      return;
    }
    const point = pointAtDistance(geo, d);
    if (!point) {
      issues.add(issueAt(sources[p], `k outside the path: distance ${d} 1/Å is beyond the path's end at ${geo.total} 1/Å`));
      return;
    }
    kFrac.push(point);
    distance.push(d);
  });
  return { kFrac, distance };
}

function resolveFractional(doc: ModelDocument, parsed: ParsedReferenceBands, sources: KSource[], issues: IssueList) {
  const dim = doc.lattice.dimension;
  const width = parsed.k[0]?.length ?? dim;
  if (width !== dim) {
    issues.add(issueAt(sources[0], `the file gives ${width} fractional coordinate(s) per point but the model's lattice is ${dim}-dimensional`));
    return { kFrac: [], distance: [] };
  }
  const kFrac = parsed.k.map((row) => row.slice());
  let distance: number[] | null = null;
  try {
    distance = distancesAlongPath(pathGeometry(doc), kFrac);
  } catch {
    // a default path that does not fit the lattice is the document's problem, reported by its own checks
    distance = null;
  }
  return { kFrac, distance: distance ?? polylineDistances(reciprocalVectors(doc.lattice.vectors), kFrac) };
}

/**
 * Places parsed reference bands on the model's k-points: an index picks `samplePath(doc, pointsTotal)`'s point,
 * a distance is interpolated along the default path's legs, fractional points are kept as given. The distance
 * of fractional points is their place on the default path when they follow it, else their own polyline length.
 */
export function resolveReferenceBands(doc: ModelDocument, parsed: ParsedReferenceBands, pointsTotal?: number): ResolvedReferenceBands {
  const sources = sourcesOf(parsed);
  const issues = new IssueList();
  const { kFrac, distance } =
    parsed.kKind === "index"
      ? resolveIndices(doc, parsed, sources, issues, pointsTotal)
      : parsed.kKind === "path"
        ? resolveDistances(doc, parsed, sources, issues)
        : resolveFractional(doc, parsed, sources, issues);
  if (issues.items.length > 0) throw new ReferenceBandsError(issues.items);
  return { kFrac, energies: parsed.energies.map((row) => row.slice()), distance };
}
