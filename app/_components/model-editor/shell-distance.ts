import { cellMeasure, norm, reciprocalVectors, type Vec3 } from "@/lib/tb/lattice";
import { distinctBondLengths } from "@/lib/tb/neighbours";
import type { Draft } from "./draft-path";
import { asArray, asRecord, readSites } from "./draft-read";

function numericRows(value: unknown): number[][] | null {
  const rows = asArray(value).map((row) => asArray(row));
  return rows.every((row) => row.length === 3 && row.every((x) => typeof x === "number" && Number.isFinite(x))) ? (rows as number[][]) : null;
}

/**
 * The distance of the `index`-th distinct neighbour shell between two species (1 = nearest), so a new shell starts on
 * a real neighbour distance; null while the cell or the positions are not yet numbers. Pure geometry, cheap enough
 * for the main thread.
 */
export function neighbourShellDistance(draft: Draft, species: [string, string], index: number): number | null {
  const vectors = numericRows(asRecord(draft.lattice).vectors);
  const positions = numericRows(asArray(draft.sites).map((s) => asRecord(s).position));
  if (!vectors || !positions || vectors.length === 0 || cellMeasure(vectors) < 1e-6) return null;
  const sites = readSites(draft);
  const from = sites.flatMap((s, i) => (s.species === species[0] ? [i] : []));
  const to = sites.flatMap((s, i) => (s.species === species[1] ? [i] : []));
  if (!from.length || !to.length) return null;
  const reach = Math.max(...vectors.map(norm)) * (index + 1);
  const lengths = distinctBondLengths(vectors, reciprocalVectors(vectors), positions as Vec3[], from, to, reach).filter((l) => l > 1e-6);
  return lengths[index - 1] ?? null;
}
