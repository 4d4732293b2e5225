import { DEFAULT_CONVENTIONS } from "@/lib/tb/conventions";
import type { ModelDocument } from "@/lib/tb/document";

const SPACING = 2.5;
const LATTICE: Record<1 | 2 | 3, { vectors: [number, number, number][]; path: "chain" | "square" | "cubic" }> = {
  1: { vectors: [[SPACING, 0, 0]], path: "chain" },
  2: { vectors: [[SPACING, 0, 0], [0, SPACING, 0]], path: "square" },
  3: { vectors: [[SPACING, 0, 0], [0, SPACING, 0], [0, 0, SPACING]], path: "cubic" },
};

/**
 * A minimal valid starting point: one s orbital per cell on a simple chain, square or cubic lattice with one
 * nearest-neighbour shell. One electron half fills the band (a metal); two would fill the only band and leave no
 * conduction band for the gap finder.
 */
export function blankModelDocument(dimension: 1 | 2 | 3): ModelDocument {
  const { vectors, path } = LATTICE[dimension];
  return {
    format: "bandgate-model",
    version: 1,
    name: "new-model",
    description: "",
    conventions: { ...DEFAULT_CONVENTIONS, units: { ...DEFAULT_CONVENTIONS.units } },
    lattice: { dimension, vectors: vectors.map((v) => [...v] as [number, number, number]) },
    sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] }],
    onsite: { A: { s: 0 } },
    shells: [{ species: ["A", "A"], index: 1, distance: SPACING, tolerance: 0.001, params: { ss_sigma: -1 } }],
    electronCount: 1,
    kPath: { type: "standard", lattice: path, pointsTotal: 120 },
    validity: {},
    provenance: { referenceMethod: "not stated yet", structureSource: "not stated yet", citations: {} },
  };
}
