import { DEFAULT_CONVENTIONS } from "@/lib/tb/conventions";
import type { ModelDocument } from "@/lib/tb/document";

/**
 * An invented sp3 model on a simple-cubic grid of nx × ny × nz sites in one orthorhombic cell (a supercell), with one
 * nearest-neighbour shell: 4 orbitals per site, so nx·ny·nz·4 basis states (×2 with spin–orbit). Large grids make
 * models whose cost grows as the cube of the basis while the document stays small.
 */
export function gridModel(grid: [number, number, number], opts: { spinOrbit?: boolean; spacing?: number; pointsTotal?: number; name?: string } = {}): ModelDocument {
  const [nx, ny, nz] = grid;
  const a = opts.spacing ?? 2.5;
  const sites: ModelDocument["sites"] = [];
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) {
      for (let k = 0; k < nz; k++) sites.push({ label: `A${sites.length + 1}`, species: "A", position: [i * a, j * a, k * a], orbitals: ["s", "px", "py", "pz"] });
    }
  }
  const params = { ss_sigma: -1.2, sp_sigma: 1.6, pp_sigma: 2.4, pp_pi: -0.7 };
  const onsite = { s: -4.1, px: 2.3, py: 2.3, pz: 2.3 };
  const keys = [...Object.keys(onsite).map((o) => `onsite/A/${o}`), ...Object.keys(params).map((p) => `shell/A-A/1/${p}`), ...(opts.spinOrbit ? ["soc/A"] : [])];
  const citations = Object.fromEntries(keys.map((k) => [k, "invented for tests"]));
  return {
    format: "bandgate-model",
    version: 1,
    name: opts.name ?? `grid ${nx}x${ny}x${nz}`,
    description: "Invented test model: a supercell of a simple-cubic sp3 lattice.",
    conventions: { ...DEFAULT_CONVENTIONS, ...(opts.spinOrbit ? { spinLayout: "up-block-then-down-block" } : {}) },
    lattice: { dimension: 3, vectors: [[nx * a, 0, 0], [0, ny * a, 0], [0, 0, nz * a]] },
    sites,
    onsite: { A: onsite },
    shells: [{ species: ["A", "A"], index: 1, distance: a, tolerance: 0.001, params }],
    ...(opts.spinOrbit ? { spinOrbit: { A: 0.05 } } : {}),
    electronCount: 4 * sites.length,
    kPath: {
      type: "custom",
      points: { G: [0, 0, 0], X: [0.5, 0, 0], M: [0.5, 0.5, 0], R: [0.5, 0.5, 0.5] },
      segments: [["G", "X", "M", "G", "R"]],
      ...(opts.pointsTotal ? { pointsTotal: opts.pointsTotal } : {}),
    },
    validity: { energyWindow: [-10, 6] },
    provenance: { referenceMethod: "invented", referenceCode: "none", functional: "not applicable", structureSource: "invented grid", kMesh: "not applicable", citations },
  };
}
