import type { ModelDocument } from "../document";
import { fillHamiltonian } from "../hamiltonian";
import { evaluateAcceptance, type AcceptanceCriterionInput } from "./acceptance";
import { randomKPoints, type CheckResult } from "./check-result";
import { checkHoppingDecay, checkOutermostShell } from "./checks-shells";
import { checkDegeneracies, checkHermiticity, checkTimeReversal, checkTraceSumRule, type DeclaredDegeneracy } from "./checks-symmetry";
import type { ReferenceBands } from "./compare-reference";
import { monkhorstPackMesh } from "./mesh";
import { createDocumentMetrics } from "./metrics";

/** The physics checks run on every revision of a document. */
export interface CheckOptions {
  /** The schema has no field for them, so degeneracies are declared here (e.g. by the model family). */
  degeneracies?: DeclaredDegeneracy[];
  criteria?: AcceptanceCriterionInput[];
  reference?: ReferenceBands;
  /** Seed of the random k-points of the hermiticity and time-reversal checks. Default 1. */
  seed?: number;
  /** Monkhorst–Pack divisions per direction for the trace sum rule. Default 8. */
  meshDivisions?: number;
  /** Window for the outermost-shell check, eV. */
  window?: [number, number];
  /** Warning threshold of the outermost-shell check, eV. Default 0.5. */
  outermostShellWarnAbove?: number;
}

/** Σ on-site energies over the basis (each spin block counted with spin–orbit). */
export function onsiteTrace(doc: ModelDocument): number {
  const spinBlocks = Object.keys(doc.spinOrbit ?? {}).length > 0 ? 2 : 1;
  let sum = 0;
  for (const site of doc.sites) for (const o of site.orbitals) sum += doc.onsite[site.species][o];
  return spinBlocks * sum;
}

export function runDocumentChecks(doc: ModelDocument, opts: CheckOptions = {}): CheckResult[] {
  const metrics = createDocumentMetrics(doc, opts.reference);
  const { model, solve } = metrics;
  const n = model.size;
  const kRandom = randomKPoints(model.dimension, 8, opts.seed ?? 1);
  const matrices = kRandom.map((k) => {
    const re = new Float64Array(n * n), im = new Float64Array(n * n);
    fillHamiltonian(model, k, re, im);
    return { re, im };
  });
  const magnetic = (doc.hoppings ?? []).some((h) => (h.value.im ?? 0) !== 0);
  const mesh = monkhorstPackMesh(new Array<number>(model.dimension).fill(opts.meshDivisions ?? 8));
  const { path } = metrics.path();
  const pointOf = (label: string) => path.ticks.map((t) => ({ ...t, k: path.kFrac[t.index] })).find((t) => t.label === label)?.k;
  return [
    checkHermiticity(n, matrices),
    checkTimeReversal(solve, kRandom, magnetic),
    checkTraceSumRule(solve, mesh, onsiteTrace(doc)),
    checkDegeneracies(solve, opts.degeneracies ?? [], pointOf),
    checkHoppingDecay(doc),
    checkOutermostShell(doc, path.kFrac, opts.window, opts.outermostShellWarnAbove),
    ...evaluateAcceptance(opts.criteria ?? [], metrics),
  ];
}
