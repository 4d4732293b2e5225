import { resolveReferenceBands, type ParsedReferenceBands } from "@/lib/reference-bands";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";

export interface BandComparison {
  distance: number[];
  ticks: { index: number; label: string }[];
  base: number[][] | null;
  proposed: number[][];
  references: { name: string; distance: number[]; energies: (number | null)[][] }[];
}

const rows = (e: Float64Array[]) => e.map((r) => Array.from(r));

/**
 * Base and proposed bands on the proposal's default path (one agreed path), with each reference set placed on it.
 * A reference that no longer fits the path (e.g. the path changed) is left out rather than drawn in the wrong place.
 */
export function compareBandsOnPath(proposed: ModelDocument, base: ModelDocument | null, references: { name: string; parsed: ParsedReferenceBands & { pointsTotal?: number } }[]): BandComparison {
  const path = samplePath(proposed);
  let baseRows: number[][] | null = null;
  if (base && base.lattice.dimension === proposed.lattice.dimension) {
    try {
      baseRows = rows(computeBands(compileModel(base), path.kFrac).energies);
    } catch {
      baseRows = null;
    }
  }
  const placed = references.flatMap((r) => {
    try {
      const resolved = resolveReferenceBands(proposed, r.parsed, r.parsed.pointsTotal);
      return [{ name: r.name, distance: resolved.distance, energies: resolved.energies }];
    } catch {
      return [];
    }
  });
  return { distance: path.distance, ticks: path.ticks, base: baseRows, proposed: rows(computeBands(compileModel(proposed), path.kFrac).energies), references: placed };
}
