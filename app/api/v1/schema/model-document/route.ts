import { modelDocumentJsonSchema } from "@/lib/tb/json-schema";

export const dynamic = "force-static";

/** GET /api/v1/schema/model-document: the JSON Schema of the model document (public, no token). */
export function GET(): Response {
  return Response.json(modelDocumentJsonSchema(), { headers: { "Content-Type": "application/schema+json" } });
}
