import { resolveReferenceBands, type ParsedReferenceBands } from "@/lib/reference-bands";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel, type CompiledModel } from "@/lib/tb/model";
import { computeDos } from "@/lib/tb/analysis/dos";
import { findFermiLevel } from "@/lib/tb/analysis/fermi";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { createEnergySolver, defaultMeshDivisions, spinDegeneracyOf } from "@/lib/tb/analysis/model-solver";
import { filledBands, valenceMaximum } from "./band-edges";

export interface BandViewReference {
  id: string;
  name: string;
  distance: number[];
  energies: (number | null)[][];
  fermiLevel: number | null;
  /** Fractional k of each reference point in the proposed document's basis (for the CSV and the metrics). */
  kFrac: number[][];
  /** Proposed bands at the reference's own k-points: least-squares alignment compares like with like. */
  proposedAt: number[][];
}

/** Everything the band comparison panel draws; computed once per page view on the server. */
export interface BandViewData {
  path: { distance: number[]; ticks: { index: number; label: string }[]; kFrac: number[][] };
  /** eV, per k, ascending, on the proposed document's default path. */
  base: number[][] | null;
  proposed: number[][];
  references: BandViewReference[];
  /** From the electron count on a Monkhorst–Pack mesh with Gaussian smearing (0.05 eV, common practice). */
  baseFermi: number | null;
  proposedFermi: number | null;
  baseVbm: number | null;
  proposedVbm: number | null;
  /** States/eV per cell on one energy grid for both documents (Gaussian broadening DOS_SIGMA). */
  dos: { energy: number[]; base: number[] | null; proposed: number[] };
  electronCount: number;
  spinDegeneracy: 1 | 2;
}

export interface ReferenceInput {
  id: string;
  name: string;
  parsed: ParsedReferenceBands & { pointsTotal?: number };
}

/** About 3000 mesh points: the Fermi level settles to a few meV for the demo models at that size. */
const MESH_POINTS = 3000;
const DOS_POINTS = 401;
/**
 * Display broadening of the DOS, eV: wider than the Fermi-level smearing (0.05 eV) because a mesh of this size
 * leaves sampling ripples at 0.05 eV; the plot is for shape, the numbers come from the bands.
 */
const DOS_SIGMA = 0.12;

const rows = (e: Float64Array[]) => e.map((r) => Array.from(r));

function meshLevels(model: CompiledModel) {
  const mesh = monkhorstPackMesh(defaultMeshDivisions(model.dimension, MESH_POINTS));
  return { levels: mesh.kFrac.map(createEnergySolver(model)), weights: mesh.weights };
}

function compileBase(base: ModelDocument | null, proposed: ModelDocument): CompiledModel | null {
  if (!base || base.lattice.dimension !== proposed.lattice.dimension) return null;
  try {
    return compileModel(base);
  } catch {
    // a base release that no longer compiles is shown as absent rather than failing the review page
    return null;
  }
}

function placeReferences(proposed: ModelDocument, model: CompiledModel, references: ReferenceInput[]): BandViewReference[] {
  return references.flatMap((r) => {
    try {
      const resolved = resolveReferenceBands(proposed, r.parsed, r.parsed.pointsTotal);
      const proposedAt = rows(computeBands(model, resolved.kFrac).energies);
      return [{ id: r.id, name: r.name, distance: resolved.distance, energies: resolved.energies, fermiLevel: r.parsed.fermiLevel, kFrac: resolved.kFrac, proposedAt }];
    } catch {
      // a reference that no longer fits the proposed path is left out rather than drawn in the wrong place
      return [];
    }
  });
}

export function buildBandView(proposed: ModelDocument, base: ModelDocument | null, references: ReferenceInput[]): BandViewData {
  const model = compileModel(proposed);
  const baseModel = compileBase(base, proposed);
  const path = samplePath(proposed);
  const g = spinDegeneracyOf(model);
  const proposedBands = rows(computeBands(model, path.kFrac).energies);
  const baseBands = baseModel ? rows(computeBands(baseModel, path.kFrac).energies) : null;

  const mesh = meshLevels(model);
  const baseMesh = baseModel ? meshLevels(baseModel) : null;
  const fermi = (m: ReturnType<typeof meshLevels>, electrons: number, degeneracy: 1 | 2) =>
    findFermiLevel(m.levels, electrons, { spinDegeneracy: degeneracy, weights: m.weights }).energy;
  const baseG = baseModel ? spinDegeneracyOf(baseModel) : g;

  let lo = Infinity;
  let hi = -Infinity;
  for (const m of [mesh, baseMesh]) {
    for (const row of m?.levels ?? []) {
      lo = Math.min(lo, row[0]);
      hi = Math.max(hi, row[row.length - 1]);
    }
  }
  const range = { energyMin: lo - 0.5, energyMax: hi + 0.5, points: DOS_POINTS, sigma: DOS_SIGMA };
  const dos = computeDos(mesh.levels, range, mesh.weights);
  const baseDos = baseMesh ? computeDos(baseMesh.levels, range, baseMesh.weights) : null;

  return {
    path: { distance: path.distance, ticks: path.ticks, kFrac: path.kFrac },
    base: baseBands,
    proposed: proposedBands,
    references: placeReferences(proposed, model, references),
    baseFermi: baseMesh && base ? fermi(baseMesh, base.electronCount, baseG) : null,
    proposedFermi: fermi(mesh, proposed.electronCount, g),
    baseVbm: baseBands && base ? valenceMaximum(baseBands, filledBands(base.electronCount, baseG)) : null,
    proposedVbm: valenceMaximum(proposedBands, filledBands(proposed.electronCount, g)),
    dos: { energy: Array.from(dos.energy), base: baseDos ? Array.from(baseDos.dos) : null, proposed: Array.from(dos.dos) },
    electronCount: proposed.electronCount,
    spinDegeneracy: g,
  };
}
