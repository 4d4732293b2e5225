import { sameKPoint } from "@/lib/tb/analysis/gaps";
import { kFracToCart } from "@/lib/tb/analysis/k-geometry";

/** Where a point lies on a labelled path, for people: "Γ", or "85% along Γ–X". */
export interface PathGeometry {
  distance: number[];
  ticks: { index: number; label: string }[];
  kFrac: number[][];
}

const SAME = 1e-9;

export function placeOnPath(d: number, path: PathGeometry): string {
  const { distance, ticks } = path;
  const at = ticks.filter((t) => Math.abs(distance[t.index] - d) < SAME).map((t) => t.label);
  if (at.length > 0) return [...new Set(at)].join("|");
  for (let i = 0; i + 1 < ticks.length; i++) {
    const a = distance[ticks[i].index];
    const b = distance[ticks[i + 1].index];
    if (a < d && d < b) return `${Math.round((100 * (d - a)) / (b - a))}% along ${ticks[i].label}–${ticks[i + 1].label}`;
  }
  return `${d.toFixed(3)} Å⁻¹ along the path`;
}

export interface PathDirection {
  /** e.g. "Γ→X" (from the edge towards X) or "Γ–X" (an edge inside that leg). */
  label: string;
  /** Cartesian, 1/Å components. */
  direction: number[];
}

/**
 * The directions of the path at point `index`: at a labelled point, every leg that meets that k-point wherever the
 * path visits it (not across a jump, where two points share a distance); at an inner point, the leg it lies on.
 */
export function pathDirections(index: number, path: PathGeometry, reciprocal: number[][]): PathDirection[] {
  const { distance, ticks, kFrac } = path;
  const along = (from: number, to: number) => kFracToCart(reciprocal, kFrac[to].map((x, i) => x - kFrac[from][i]));
  const out: PathDirection[] = [];
  const same = ticks.flatMap((t, i) => (sameKPoint(kFrac[t.index], kFrac[index]) ? [i] : []));
  for (const at of same) {
    const here = ticks[at];
    const prev = ticks[at - 1];
    const next = ticks[at + 1];
    if (prev && distance[prev.index] < distance[here.index] - SAME) out.push({ label: `${here.label}→${prev.label}`, direction: along(here.index, prev.index) });
    if (next && distance[next.index] > distance[here.index] + SAME) out.push({ label: `${here.label}→${next.label}`, direction: along(here.index, next.index) });
  }
  if (same.length > 0) return out.filter((d, i) => out.findIndex((e) => e.label === d.label) === i);
  for (let i = 0; i + 1 < ticks.length; i++) {
    const [a, b] = [ticks[i], ticks[i + 1]];
    if (a.index < index && index < b.index) return [{ label: `${a.label}–${b.label}`, direction: along(a.index, b.index) }];
  }
  return out;
}
