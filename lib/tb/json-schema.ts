import { z } from "zod";
import { MODEL_DOCUMENT_SCHEMA } from "./document-schema";

/** JSON Schema (draft 2020-12) of the model document, generated from the zod schema the engine validates with. */
export function modelDocumentJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(MODEL_DOCUMENT_SCHEMA, { target: "draft-2020-12", unrepresentable: "any" }) as Record<string, unknown>;
  return {
    ...schema,
    $id: "https://bandgate.invalid/schemas/bandgate-model/1.json",
    title: "Bandgate model document, version 1",
    description: "Tight-binding model document: energies in eV, lengths in ångström. See the conventions block in every document.",
  };
}
