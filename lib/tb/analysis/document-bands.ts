import { computeBands } from "../bands";
import type { ModelDocument } from "../document";
import { samplePath, type SampledPath } from "../kpath";
import { compileModel } from "../model";
import { compareBandSets, type BandDifference } from "./compare";
import { compareWithReference, type ReferenceBands, type ReferenceCompareOptions, type ReferenceComparison } from "./compare-reference";
import { computeDos, type DosOptions, type DosResult } from "./dos";
import { findFermiLevel, type FermiMethod, type FermiResult } from "./fermi";
import { compareFreeElectron, type FreeElectronResult } from "./free-electron";
import { monkhorstPackMesh } from "./mesh";
import { createEnergySolver, defaultMeshDivisions, spinDegeneracyOf } from "./model-solver";

/** Document-level entry points of the band analysis (the review screens call these). */

/** ΔE per band and k of a proposal against its base, both on the base document's default path. */
export function compareDocuments(base: ModelDocument, proposed: ModelDocument, pointsTotal?: number): BandDifference & {
  path: SampledPath;
  base: Float64Array[];
  proposed: Float64Array[];
} {
  const path = samplePath(base, pointsTotal);
  const a = computeBands(compileModel(base), path.kFrac).energies;
  const b = computeBands(compileModel(proposed), path.kFrac).energies;
  return { ...compareBandSets(a, b), path, base: a, proposed: b };
}

/** Document against reference bands; occupiedBands and the model Fermi level are filled in from the document. */
export function compareDocumentWithReference(
  doc: ModelDocument,
  reference: ReferenceBands,
  opts: ReferenceCompareOptions,
): ReferenceComparison {
  const model = compileModel(doc);
  const energies = computeBands(model, reference.kFrac).energies;
  const occupiedBands = opts.occupiedBands ?? Math.round(doc.electronCount / spinDegeneracyOf(model));
  const modelFermi = opts.alignment === "fermi" ? (opts.modelFermi ?? findDocumentFermiLevel(doc).energy) : opts.modelFermi;
  return compareWithReference(energies, reference, { ...opts, occupiedBands, modelFermi });
}

export interface MeshChoice {
  /** Monkhorst–Pack divisions; default about 4000 points in the lattice dimension. */
  divisions?: number[];
}

export function computeDocumentDos(doc: ModelDocument, opts: DosOptions & MeshChoice = {}): DosResult {
  const model = compileModel(doc);
  const mesh = monkhorstPackMesh(opts.divisions ?? defaultMeshDivisions(model.dimension));
  return computeDos(mesh.kFrac.map(createEnergySolver(model)), opts, mesh.weights);
}

export function findDocumentFermiLevel(doc: ModelDocument, opts: MeshChoice & { method?: FermiMethod; sigma?: number } = {}): FermiResult {
  const model = compileModel(doc);
  const mesh = monkhorstPackMesh(opts.divisions ?? defaultMeshDivisions(model.dimension));
  return findFermiLevel(mesh.kFrac.map(createEnergySolver(model)), doc.electronCount, {
    spinDegeneracy: spinDegeneracyOf(model),
    weights: mesh.weights,
    method: opts.method,
    sigma: opts.sigma,
  });
}

/** Free-electron comparison of the lowest band along the document's default path (fit radius in Å⁻¹). */
export function compareDocumentFreeElectron(doc: ModelDocument, radius?: number, pointsTotal?: number): FreeElectronResult & { path: SampledPath } {
  const model = compileModel(doc);
  const path = samplePath(doc, pointsTotal);
  const energies = computeBands(model, path.kFrac).energies.map((row) => row[0]);
  const gammaEnergy = createEnergySolver(model)(new Array<number>(model.dimension).fill(0))[0];
  return { ...compareFreeElectron({ kFrac: path.kFrac, energies, gammaEnergy, reciprocal: model.reciprocal, radius }), path };
}
