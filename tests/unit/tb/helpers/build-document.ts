import { DEFAULT_CONVENTIONS } from "@/lib/tb/conventions";
import type { ModelDocument } from "@/lib/tb/document";

type Partial1 = Pick<ModelDocument, "lattice" | "sites" | "onsite" | "shells"> & Partial<ModelDocument>;

/** A complete document around the physics parts a test cares about (metadata filled with placeholders). */
export function buildDocument(parts: Partial1): ModelDocument {
  const d = parts.lattice.dimension;
  return {
    format: "bandgate-model",
    version: 1,
    name: "test model",
    conventions: { ...DEFAULT_CONVENTIONS, ...(parts.spinOrbit ? { spinLayout: "up-block-then-down-block" } : {}) },
    electronCount: 0,
    kPath: { type: "custom", points: { G: new Array(d).fill(0), X: [0.5, ...new Array(d - 1).fill(0)] }, segments: [["G", "X"]] },
    validity: {},
    provenance: { referenceMethod: "test", structureSource: "test", citations: {} },
    ...parts,
  };
}

export const FCC = (a: number): [number, number, number][] => [[0, a / 2, a / 2], [a / 2, 0, a / 2], [a / 2, a / 2, 0]];
