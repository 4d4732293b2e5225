import type { StoredReference } from "@/lib/fits/problem";
import { fitSpecSchema, type FitSpec, type FitSpecInput } from "@/lib/fits/spec";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { seededNormal } from "../tb/analysis/seeded-noise";

/** A stored reference set (k given as path indices) with the bands of `truth` plus seeded noise of `sigma` eV. */
export function storedReference(truth: ModelDocument, sigma = 0, seed = 1, extraBandBelow?: number): StoredReference {
  const path = samplePath(truth);
  const noise = seededNormal(seed);
  const energies = computeBands(compileModel(truth), path.kFrac).energies.map((row) => {
    const values = Array.from(row, (e) => e + sigma * noise());
    return extraBandBelow === undefined ? values : [extraBandBelow, ...values];
  });
  return { kKind: "index", k: path.kFrac.map((_, i) => [i]), energies, fermiLevel: null, bandCount: energies[0].length, pointCount: energies.length };
}

export const REFERENCE_ID = "00000000-0000-4000-8000-000000000001";

export function spec(input: Partial<FitSpecInput> & Pick<FitSpecInput, "parameters">): FitSpec {
  return fitSpecSchema.parse({ referenceSetId: REFERENCE_ID, ...input });
}
