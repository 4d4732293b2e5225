import { DEFAULT_CONVENTIONS } from "@/lib/tb/conventions";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";

/** Small model documents with invented demo values for the analysis tests. */
function base(name: string) {
  return {
    format: "bandgate-model" as const,
    version: 1 as const,
    name,
    conventions: DEFAULT_CONVENTIONS,
    validity: {},
    provenance: { referenceMethod: "invented demo values", structureSource: "invented demo values", citations: {} },
  };
}

const chainPath = { type: "custom" as const, points: { "Γ": [0], X: [0.5] }, segments: [["Γ", "X"]], pointsTotal: 41 };

/** One s orbital per site along x: E = ε + 2t·cos(2πk). */
export function sChainDocument(eps = 0.5, t = -1, a = 2.5): ModelDocument {
  return parseModelDocument({
    ...base("s chain"),
    lattice: { dimension: 1, vectors: [[a, 0, 0]] },
    sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] }],
    onsite: { A: { s: eps } },
    shells: [{ species: ["A", "A"], index: 1, distance: a, params: { ss_sigma: t } }],
    electronCount: 1,
    kPath: chainPath,
  });
}

/** s + pz along a chain in z, nearest and second neighbours. */
export function spChainDocument(params: Partial<Record<string, number>> = {}): ModelDocument {
  const a = 2;
  return parseModelDocument({
    ...base("sp chain"),
    lattice: { dimension: 1, vectors: [[0, 0, a]] },
    sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s", "pz"] }],
    onsite: { A: { s: params.es ?? -4, pz: params.ep ?? 2 } },
    shells: [
      { species: ["A", "A"], index: 1, distance: a, params: { ss_sigma: params.ss ?? -1.2, sp_sigma: params.sp ?? 1.1, pp_sigma: params.pp ?? 1.8, pp_pi: 0 } },
      { species: ["A", "A"], index: 2, distance: 2 * a, params: { ss_sigma: params.ss2 ?? -0.1, sp_sigma: params.sp2 ?? 0.15, pp_sigma: params.pp2 ?? 0.2, pp_pi: 0 } },
    ],
    electronCount: 2,
    kPath: chainPath,
  });
}

/** Honeycomb pz (graphene-like), nearest-neighbour pp_pi = t. */
export function honeycombDocument(t = -2.7, a = 2.46): ModelDocument {
  const a1 = [a, 0, 0];
  const a2 = [a / 2, (a * Math.sqrt(3)) / 2, 0];
  return parseModelDocument({
    ...base("honeycomb pz"),
    lattice: { dimension: 2, vectors: [a1, a2] },
    sites: [
      { label: "C1", species: "C", position: [0, 0, 0], orbitals: ["pz"] },
      { label: "C2", species: "C", position: [(a1[0] + a2[0]) / 3, (a1[1] + a2[1]) / 3, 0], orbitals: ["pz"] },
    ],
    onsite: { C: { pz: 0 } },
    shells: [{ species: ["C", "C"], index: 1, distance: a / Math.sqrt(3), params: { pp_sigma: 0, pp_pi: t } }],
    electronCount: 2,
    kPath: { type: "custom", points: { "Γ": [0, 0], M: [0.5, 0], K: [1 / 3, 2 / 3] }, segments: [["Γ", "M", "K", "Γ"]], pointsTotal: 61 },
  });
}

/** Two-species sp3 zinc-blende model with nearest-neighbour bonds (invented demo values, 5.65 Å cube). */
export function zincBlendeDocument(overrides: Record<string, number> = {}, spinOrbit?: Record<string, number>): ModelDocument {
  const a = 5.65;
  const h = a / 2;
  const params = { ss_sigma: -1.7, sp_sigma: 2.1, ps_sigma: 2.4, pp_sigma: 3.0, pp_pi: -0.8, ...overrides };
  return parseModelDocument({
    ...base("zinc-blende sp3"),
    conventions: spinOrbit ? { ...DEFAULT_CONVENTIONS, spinLayout: "up-block-then-down-block" } : DEFAULT_CONVENTIONS,
    lattice: { dimension: 3, vectors: [[0, h, h], [h, 0, h], [h, h, 0]] },
    sites: [
      { label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s", "px", "py", "pz"] },
      { label: "B1", species: "B", position: [a / 4, a / 4, a / 4], orbitals: ["s", "px", "py", "pz"] },
    ],
    onsite: { A: { s: -8.3, px: 1.0, py: 1.0, pz: 1.0 }, B: { s: -2.7, px: 3.6, py: 3.6, pz: 3.6 } },
    shells: [{ species: ["A", "B"], index: 1, distance: (a * Math.sqrt(3)) / 4, params }],
    ...(spinOrbit ? { spinOrbit } : {}),
    electronCount: 8,
    kPath: { type: "custom", points: { L: [0.5, 0.5, 0.5], "Γ": [0, 0, 0], X: [0, 0.5, 0.5] }, segments: [["L", "Γ", "X"]], pointsTotal: 61 },
  });
}

/** Two s sites per cell with alternating bonds v (d1) and w (d2): bands ±|v + w·e^{i2πk}|. */
export function dimerChainDocument(v = -1.2, w = -0.7, d1 = 1.4, d2 = 1.6): ModelDocument {
  return parseModelDocument({
    ...base("dimerised chain"),
    lattice: { dimension: 1, vectors: [[d1 + d2, 0, 0]] },
    sites: [
      { label: "A1", species: "A", position: [0, 0, 0], orbitals: ["s"] },
      { label: "A2", species: "A", position: [d1, 0, 0], orbitals: ["s"] },
    ],
    onsite: { A: { s: 0 } },
    shells: [
      { species: ["A", "A"], index: 1, distance: d1, params: { ss_sigma: v } },
      { species: ["A", "A"], index: 2, distance: d2, params: { ss_sigma: w } },
    ],
    electronCount: 2,
    kPath: chainPath,
  });
}
