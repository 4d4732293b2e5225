import { readFileSync } from "node:fs";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";

/** The demo s + pz chain (one atom per cell along z, a = 2.5 Å) as a test document. */
export function chain(): ModelDocument {
  return parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-sp-chain.json", "utf8")));
}
