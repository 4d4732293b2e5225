import { readFileSync } from "node:fs";
import type { ParsedReferenceBands } from "@/lib/reference-bands";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";

/** Shared fixtures of the band-review tests: the seeded demo diamond model and references made from a document. */
export function demoDiamond(pointsTotal = 120): ModelDocument {
  const doc = parseModelDocument(JSON.parse(readFileSync(new URL("../../../db/seed/models/demo-diamond-sp3s.json", import.meta.url), "utf8")));
  return { ...doc, kPath: { ...doc.kPath, pointsTotal } };
}

/** Every on-site energy raised by c: H → H + c·1, so every band moves by exactly c (analytic). */
export function shiftedOnsite(doc: ModelDocument, c: number): ModelDocument {
  const onsite = Object.fromEntries(Object.entries(doc.onsite).map(([sp, o]) => [sp, Object.fromEntries(Object.entries(o).map(([k, v]) => [k, (v as number) + c]))]));
  return { ...doc, onsite } as ModelDocument;
}

/** Reference bands "measured" from a document on its own path (fractional k), every energy + shift. */
export function referenceFrom(doc: ModelDocument, shift = 0, fermiLevel: number | null = null): ParsedReferenceBands {
  const path = samplePath(doc);
  const energies = computeBands(compileModel(doc), path.kFrac).energies.map((row) => Array.from(row, (e) => e + shift));
  return { kKind: "fractional", k: path.kFrac, energies, fermiLevel, bandCount: energies[0].length, pointCount: energies.length };
}
