import { readFileSync } from "node:fs";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";

export const SEED_NAMES = ["demo-sp-chain", "demo-honeycomb-pz", "demo-diamond-sp3s"] as const;

export function seedDocument(name: (typeof SEED_NAMES)[number]): ModelDocument {
  return parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));
}

/**
 * A seed document with the provenance a submission needs and the seeds leave out (the demo values were not computed,
 * so code, functional and k-mesh are filled with plain placeholders).
 */
export function completeDocument(name: (typeof SEED_NAMES)[number]): ModelDocument {
  const doc = seedDocument(name);
  doc.provenance = { ...doc.provenance, referenceCode: "none (invented values)", functional: "not applicable", kMesh: "not applicable" };
  return doc;
}
