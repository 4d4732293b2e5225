import type { PathGeometry } from "./band-place";

/** The path point nearest to a distance (1/Å). */
export function nearestPathIndex(distance: readonly number[], d: number): number {
  let best = 0;
  for (let i = 1; i < distance.length; i++) if (Math.abs(distance[i] - d) < Math.abs(distance[best] - d)) best = i;
  return best;
}

/** A path end for people and links: the tick label when the distance is on a tick, else the distance with 3 decimals. */
export function rangeEndLabel(path: Pick<PathGeometry, "distance" | "ticks">, d: number, tolerance = 1e-6): string {
  const labels = path.ticks.filter((t) => Math.abs(path.distance[t.index] - d) <= tolerance).map((t) => t.label);
  return labels.length > 0 ? [...new Set(labels)].join("|") : d.toFixed(3);
}

/** Link that opens a remark anchored to a k-range of the band plot. */
export function remarkRangeHref(remarkBase: string, path: Pick<PathGeometry, "distance" | "ticks">, range: [number, number]): string {
  const [a, b] = range[0] <= range[1] ? range : [range[1], range[0]];
  const from = encodeURIComponent(rangeEndLabel(path, a));
  const to = encodeURIComponent(rangeEndLabel(path, b));
  return `${remarkBase}?remark=k:${from}-${to}#remarks`;
}
