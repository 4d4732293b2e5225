/** The OpenAPI 3.1 description of REST API v1, served at /api/v1/openapi.json. */
const error = (description: string) => ({ description, content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } });

const slug = { name: "slug", in: "path", required: true, schema: { type: "string" }, description: "Model family slug." };
const version = {
  name: "version",
  in: "path",
  required: true,
  schema: { type: "string" },
  description: 'Semantic version, e.g. 1.1.0, or "latest" for the newest release that is neither deprecated nor withdrawn.',
};
const format = (values: string[]) => ({ name: "format", in: "query", required: false, schema: { type: "string", enum: values, default: values[0] } });

const guarded = (summary: string, parameters: unknown[], ok: Record<string, unknown>, extra: Record<string, unknown> = {}) => ({
  get: {
    summary,
    security: [{ bearer: [] }],
    parameters,
    responses: {
      "200": ok,
      ...extra,
      "401": error("Missing, revoked or unknown token."),
      "404": error("Unknown family or version."),
      "429": { ...error("Rate limit of the token reached; see Retry-After."), headers: { "Retry-After": { schema: { type: "integer" } } } },
    },
  },
});

const json = (description: string, schema: unknown = { type: "object" }) => ({ description, content: { "application/json": { schema } } });

export function openApiDocument(): Record<string, unknown> {
  return {
    openapi: "3.1.0",
    info: {
      title: "Bandgate registry API",
      version: "1.0.0",
      description: "Read released tight-binding model documents by family, version and checksum. Energies in eV, lengths in Å.",
    },
    servers: [{ url: "/api/v1" }],
    components: {
      securitySchemes: { bearer: { type: "http", scheme: "bearer", description: "API token from Settings → API tokens (read-only scope)." } },
      schemas: {
        Error: {
          type: "object",
          required: ["error"],
          properties: { error: { type: "object", required: ["code", "message"], properties: { code: { type: "string" }, message: { type: "string" } } } },
        },
      },
    },
    paths: {
      "/families": guarded("List model families with their latest release.", [], json("Families.")),
      "/families/{slug}/releases": guarded("List a family's releases, newest first.", [slug], json("Releases.")),
      "/families/{slug}/releases/{version}": guarded("One release: checksum, status, changelog, links.", [slug, version], json("Release.")),
      "/families/{slug}/releases/{version}/document": guarded(
        "The model document, byte for byte the canonical text whose sha256 is the release checksum.",
        [slug, version, { name: "If-None-Match", in: "header", required: false, schema: { type: "string" } }],
        { ...json("Model document.", { $ref: "/api/v1/schema/model-document" }), headers: { ETag: { schema: { type: "string" }, description: "The quoted sha256." } } },
        { "304": { description: "If-None-Match matched the ETag: the copy you hold is current." } },
      ),
      "/families/{slug}/releases/{version}/hoppings": guarded(
        "Real-space hopping list H_ij(R), on-site energies included.",
        [slug, version, format(["json", "csv"])],
        { description: "Hopping list.", content: { "application/json": { schema: { type: "object" } }, "text/csv": { schema: { type: "string" } } } },
      ),
      "/families/{slug}/releases/{version}/bands": guarded(
        "Band energies on the default path, or at given fractional k-points.",
        [
          slug,
          version,
          format(["json", "csv"]),
          { name: "k", in: "query", required: false, schema: { type: "string" }, description: 'Fractional k-points "k1,k2,k3;k1,k2,k3" (as many numbers as the lattice dimension).' },
          { name: "points", in: "query", required: false, schema: { type: "integer", minimum: 2, maximum: 5000 }, description: "Points on the default path." },
        ],
        { description: "Bands.", content: { "application/json": { schema: { type: "object" } }, "text/csv": { schema: { type: "string" } } } },
        { "400": error("Malformed k-points.") },
      ),
      "/schema/model-document": { get: { summary: "JSON Schema of the model document (no token needed).", security: [], responses: { "200": json("JSON Schema.") } } },
      "/openapi.json": { get: { summary: "This description (no token needed).", security: [], responses: { "200": json("OpenAPI document.") } } },
    },
  };
}
