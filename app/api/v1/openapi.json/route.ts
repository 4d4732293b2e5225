import { openApiDocument } from "@/lib/registry/openapi";

export const dynamic = "force-static";

/** GET /api/v1/openapi.json: the description of this API (public, no token); prerendered at build time. */
export function GET(): Response {
  return Response.json(openApiDocument());
}
