import type { ModelDocument } from "../document";
import { compileModel } from "../model";
import { mirrorBondKey } from "../orbitals";
import { listParameters, setParameters } from "../parameters";
import type { ReferenceBands } from "./compare-reference";
import { fitBandModel, type FitResult } from "./fit";
import { FitInputError, type BandFitOptions } from "./fit-input";
import { spinDegeneracyOf } from "./model-solver";
import { buildDerivativeModels, computeBandDerivatives } from "./sensitivity";

/**
 * Fit of chosen document parameters (keys from listParameters) to reference bands. The Jacobian is exact and cheap:
 * ∂E_n(k)/∂p by Hellmann–Feynman with the fixed ∂H/∂p models (H is linear in every parameter).
 */
export interface DocumentFitResult extends FitResult {
  /** The document with the best values. */
  document: ModelDocument;
}

export async function fitDocument(
  doc: ModelDocument,
  keys: string[],
  reference: ReferenceBands,
  opts: BandFitOptions & { start?: Record<string, number> } = {},
): Promise<DocumentFitResult> {
  const params = new Map(listParameters(doc).map((p) => [p.key, p.value]));
  for (const key of keys) {
    if (!params.has(key)) throw new FitInputError(`fit: unknown parameter key "${key}"`);
    const parts = key.split("/");
    const [a, b] = parts[0] === "shell" ? parts[1].split("-") : [];
    const mirror = parts[0] === "shell" ? `${parts.slice(0, 3).join("/")}/${mirrorBondKey(parts[3])}` : key;
    if (a === b && mirror !== key && params.has(mirror)) {
      throw new FitInputError(`fit: ${key} and ${mirror} are one integral in a one-species shell; keep only one of them in the document to fit it`);
    }
  }
  const d = doc.lattice.dimension;
  reference.kFrac.forEach((k, i) => {
    if (k.length !== d) throw new FitInputError(`fit: reference k-point ${i} has ${k.length} components, the lattice has dimension ${d}`);
  });
  const start = keys.map((k) => opts.start?.[k] ?? (params.get(k) as number));
  const derivativeModels = buildDerivativeModels(doc, keys);
  const withValues = (p: ArrayLike<number>) => setParameters(doc, Object.fromEntries(keys.map((k, i) => [k, p[i]])));
  const occupiedBands = opts.occupiedBands ?? Math.round(doc.electronCount / spinDegeneracyOf(compileModel(doc)));
  const result = await fitBandModel(
    { evaluate: (p) => computeBandDerivatives(compileModel(withValues(p)), derivativeModels, reference.kFrac) },
    keys,
    start,
    reference,
    { ...opts, occupiedBands },
  );
  return { ...result, document: withValues(result.values) };
}
