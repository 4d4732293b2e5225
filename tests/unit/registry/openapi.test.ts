import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/registry/openapi";

/** Every route handler under app/api/v1, as an OpenAPI path ("[slug]" → "{slug}"). */
function routePaths(dir = "app/api/v1"): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) out.push(...routePaths(full));
    else if (name === "route.ts") out.push("/" + relative("app/api/v1", dir).replace(/\[(\w+)\]/g, "{$1}"));
  }
  return out.sort();
}

describe("OpenAPI description", () => {
  const doc = openApiDocument() as { openapi: string; paths: Record<string, { get: { security: unknown[]; responses: Record<string, unknown> } }> };

  it("describes exactly the routes that exist", () => {
    expect(Object.keys(doc.paths).sort()).toEqual(routePaths());
  });

  it("documents 401, 404 and 429 wherever a token is needed, and 304 on the document", () => {
    for (const [path, item] of Object.entries(doc.paths)) {
      if (item.get.security.length === 0) continue;
      expect(Object.keys(item.get.responses), path).toEqual(expect.arrayContaining(["200", "401", "404", "429"]));
    }
    expect(doc.paths["/families/{slug}/releases/{version}/document"].get.responses).toHaveProperty("304");
  });

  it("is OpenAPI 3.1", () => {
    expect(doc.openapi).toBe("3.1.0");
  });
});
