import { computeBands } from "../bands";
import type { ModelDocument } from "../document";
import { samplePath, type SampledPath } from "../kpath";
import { compileModel, type CompiledModel } from "../model";
import { compareWithReference, type ReferenceBands, type ReferenceCompareOptions, type ReferenceComparison } from "./compare-reference";
import type { EnergySolver, SpinDegeneracy } from "./constants";
import { findFermiLevel } from "./fermi";
import { computeBandwidths, findBandGap, type Bandwidth, type GapResult } from "./gaps";
import { computeEffectiveMass, type MassResult } from "./masses";
import { monkhorstPackMesh } from "./mesh";
import { createEnergySolver, defaultMeshDivisions, spinDegeneracyOf } from "./model-solver";

/** Lazily computed numbers of one document, shared by the acceptance criteria and the review screens. */
export interface DocumentMetrics {
  model: CompiledModel;
  solve: EnergySolver;
  spinDegeneracy: SpinDegeneracy;
  path(): { path: SampledPath; energies: Float64Array[] };
  /** Gap on the default path. */
  gap(): GapResult;
  bandwidths(): Bandwidth[];
  /** Fermi level on a Monkhorst–Pack mesh, Gaussian smearing 0.05 eV (common practice). */
  fermiLevel(): number;
  mass(edge: "vbm" | "cbm", direction: number[]): MassResult | null;
  /** null when no reference bands were given. */
  compareReference(opts: ReferenceCompareOptions): ReferenceComparison | null;
}

export function createDocumentMetrics(doc: ModelDocument, reference?: ReferenceBands): DocumentMetrics {
  const model = compileModel(doc);
  const solve = createEnergySolver(model);
  const g = spinDegeneracyOf(model);
  const once = <T>(f: () => T) => {
    let v: { value: T } | undefined;
    return () => (v ??= { value: f() }).value;
  };
  const path = once(() => {
    const p = samplePath(doc);
    return { path: p, energies: computeBands(model, p.kFrac).energies };
  });
  const gap = once(() => {
    const { path: p, energies } = path();
    return findBandGap({ energies, kFrac: p.kFrac, electronCount: doc.electronCount, spinDegeneracy: g, ticks: p.ticks });
  });
  const fermiLevel = once(() => {
    const mesh = monkhorstPackMesh(defaultMeshDivisions(model.dimension, 3000));
    return findFermiLevel(mesh.kFrac.map(solve), doc.electronCount, { spinDegeneracy: g, weights: mesh.weights }).energy;
  });
  const referenceEnergies = once(() => (reference ? computeBands(model, reference.kFrac).energies : null));
  return {
    model,
    solve,
    spinDegeneracy: g,
    path,
    gap,
    bandwidths: once(() => computeBandwidths(path().energies)),
    fermiLevel,
    mass(edge, direction) {
      const res = gap();
      const at = edge === "vbm" ? res.vbm : res.cbm;
      if (res.kind !== "insulator" || !at) return null;
      return computeEffectiveMass(solve, { band: at.band, kFrac: at.kFrac, direction, reciprocal: model.reciprocal });
    },
    compareReference(opts) {
      const energies = referenceEnergies();
      return energies && reference ? compareWithReference(energies, reference, opts) : null;
    },
  };
}
