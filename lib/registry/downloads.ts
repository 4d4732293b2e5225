import { computeBands } from "@/lib/tb/bands";
import { realSpaceHoppings, type RealSpaceHopping } from "@/lib/tb/hoppings";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import type { ModelDocument } from "@/lib/tb/document";

/** What downstream codes download besides the document: the real-space hopping list and bands. */
export function releaseHoppings(doc: ModelDocument): RealSpaceHopping[] {
  return realSpaceHoppings(compileModel(doc), doc.sites.map((s) => s.position));
}

const csvCell = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

export function hoppingsCsv(list: readonly RealSpaceHopping[]): string {
  const head = "from,to,n1,n2,n3,x_angstrom,y_angstrom,z_angstrom,distance_angstrom,re_ev,im_ev";
  const rows = list.map((h) =>
    [csvCell(h.from), csvCell(h.to), ...[0, 1, 2].map((i) => String(h.translation[i] ?? 0)), ...h.vector.map(String), String(h.distance), String(h.re), String(h.im)].join(","),
  );
  return [head, ...rows].join("\n") + "\n";
}

export interface ReleaseBands {
  /** Fractional k-points in the reciprocal primitive vectors. */
  kFrac: number[][];
  /** Cumulative path length (1/Å) on the default path; absent for a given list of points. */
  distance?: number[];
  ticks?: { index: number; label: string }[];
  energies: number[][];
}

export function bandsOnDefaultPath(doc: ModelDocument, pointsTotal?: number): ReleaseBands {
  const path = samplePath(doc, pointsTotal);
  const { energies } = computeBands(compileModel(doc), path.kFrac);
  return { kFrac: path.kFrac, distance: path.distance, ticks: path.ticks, energies: energies.map((e) => Array.from(e)) };
}

export function bandsAtPoints(doc: ModelDocument, kFrac: number[][]): ReleaseBands {
  const { energies } = computeBands(compileModel(doc), kFrac);
  return { kFrac, energies: energies.map((e) => Array.from(e)) };
}

export function bandsCsv(bands: ReleaseBands): string {
  const dims = bands.kFrac[0]?.length ?? 1;
  const nBands = bands.energies[0]?.length ?? 0;
  const head = [...(bands.distance ? ["distance_inv_angstrom"] : []), ...Array.from({ length: dims }, (_, i) => `k${i + 1}`), ...Array.from({ length: nBands }, (_, i) => `band_${i + 1}_ev`)];
  const rows = bands.kFrac.map((k, i) => [...(bands.distance ? [bands.distance[i]] : []), ...k, ...bands.energies[i]].map(String).join(","));
  return [head.join(","), ...rows].join("\n") + "\n";
}

/**
 * Fractional coordinates beyond this size say nothing a smaller equivalent point would not (bands are periodic in k),
 * and at 1e308 the phases overflow to non-finite values.
 */
export const K_FRACTIONAL_LIMIT = 1000;

/**
 * k-points from a query string: "k1,k2,k3;k1,k2,k3" with `dimension` numbers each. Returns a message when malformed.
 */
export function parseKPointList(text: string, dimension: number, max = 2000): number[][] | string {
  const points = text.split(";").filter((p) => p.trim() !== "");
  if (points.length === 0) return "Give at least one k-point.";
  if (points.length > max) return `At most ${max} k-points per request.`;
  const out: number[][] = [];
  for (const [i, p] of points.entries()) {
    const k = p.split(",").map((x) => (x.trim() === "" ? NaN : Number(x)));
    if (k.length !== dimension || !k.every((x) => Number.isFinite(x) && Math.abs(x) <= K_FRACTIONAL_LIMIT)) {
      return `k-point ${i + 1} must hold ${dimension} finite numbers (the lattice dimension), each between −${K_FRACTIONAL_LIMIT} and ${K_FRACTIONAL_LIMIT} (fractional coordinates).`;
    }
    out.push(k);
  }
  return out;
}
