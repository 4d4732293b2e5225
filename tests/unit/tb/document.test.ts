import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ModelDocumentError, parseModelDocument, validateModelDocument } from "@/lib/tb/document";
import { modelDocumentJsonSchema } from "@/lib/tb/json-schema";
import { GALLIUM_ARSENIDE, voglDocument } from "./helpers/vogl-1983";

const raw = (name: string) => JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8"));
const errorsOf = (input: unknown) => validateModelDocument(input).errors;

function expectIssue(input: unknown, path: string, pattern: RegExp) {
  const errors = errorsOf(input);
  const hit = errors.find((e) => e.path === path && pattern.test(e.message));
  expect(hit, `expected ${path} ~ ${pattern}; got ${JSON.stringify(errors)}`).toBeDefined();
}

describe("model document validation", () => {
  it("accepts the three demo documents without warnings", () => {
    for (const name of ["demo-sp-chain", "demo-honeycomb-pz", "demo-diamond-sp3s"]) {
      const report = validateModelDocument(raw(name));
      expect(report.errors).toEqual([]);
      expect(report.warnings).toEqual([]);
    }
  });

  it("names the field of an unknown orbital", () => {
    const doc = raw("demo-sp-chain");
    doc.sites[0].orbitals = ["s", "pq"];
    expectIssue(doc, "sites[0].orbitals[1]", /./);
  });

  it("rejects NaN and Infinity with the field path", () => {
    const doc = raw("demo-sp-chain");
    doc.onsite.A.s = Number.NaN;
    doc.shells[0].params.ss_sigma = Number.POSITIVE_INFINITY;
    expectIssue(doc, "onsite.A.s", /NaN/);
    expectIssue(doc, "shells[0].params.ss_sigma", /Infinity/);
  });

  it("rejects a shell distance that matches no neighbour, listing the nearest distances", () => {
    const doc = raw("demo-diamond-sp3s");
    doc.shells[0].distance = 2.2;
    expectIssue(doc, "shells[0].distance", /matches no X–X neighbour.*2\.3816/);
  });

  it("rejects a parameter for an orbital pair no site has", () => {
    const doc = raw("demo-honeycomb-pz");
    doc.shells[0].params.dd_sigma = 0.1;
    expectIssue(doc, "shells[0].params.dd_sigma", /orbital pair no site has/);
  });

  it("rejects a missing ps_sigma in a two-species shell", () => {
    const doc = voglDocument(GALLIUM_ARSENIDE);
    delete doc.shells[0].params.ps_sigma;
    expectIssue(doc, "shells[0].params.ps_sigma", /missing ps_sigma \(two-species shell/);
  });

  it("rejects a one-species shell with unequal sp_sigma and ps_sigma (H would not be Hermitian)", () => {
    const doc = raw("demo-diamond-sp3s");
    doc.shells[0].params.ps_sigma = doc.shells[0].params.sp_sigma + 0.1;
    expectIssue(doc, "shells[0].params.ps_sigma", /not be Hermitian/);
  });

  it("rejects unknown Slater–Koster keys, unknown fields and a missing on-site energy", () => {
    const doc = raw("demo-sp-chain");
    doc.shells[0].params.sp_delta = 1;
    doc.colour = "red";
    delete doc.onsite.A.pz;
    expectIssue(doc, "shells[0].params.sp_delta", /unknown Slater–Koster key/);
    expectIssue(doc, "", /colour/);
    const other = raw("demo-sp-chain");
    delete other.onsite.A.pz;
    expectIssue(other, "onsite.A.pz", /missing on-site energy/);
  });

  it("checks the convention manifest against the document", () => {
    const doc = raw("demo-diamond-sp3s");
    doc.spinOrbit = { X: 0.1 };
    expectIssue(doc, "conventions.spinLayout", /up-block-then-down-block/);
    const wrongRule = raw("demo-sp-chain");
    wrongRule.conventions.slaterKosterKeys = "t1-on-to-atom";
    expectIssue(wrongRule, "conventions.slaterKosterKeys", /./);
  });

  it("rejects explicit hoppings to unknown orbitals, wrong translations and duplicates", () => {
    const doc = raw("demo-sp-chain");
    doc.hoppings = [
      { from: { site: "A1", orbital: "s" }, to: { site: "A1", orbital: "px" }, translation: [1], value: { re: 0.1 } },
      { from: { site: "A1", orbital: "s" }, to: { site: "A1", orbital: "pz" }, translation: [2, 0], value: { re: 0.1 } },
      { from: { site: "A1", orbital: "s" }, to: { site: "A1", orbital: "s" }, translation: [2], value: { re: 0.1 } },
      { from: { site: "A1", orbital: "s" }, to: { site: "A1", orbital: "s" }, translation: [-2], value: { re: 0.1 } },
    ];
    expectIssue(doc, "hoppings[0].to.orbital", /no orbital px/);
    expectIssue(doc, "hoppings[1].translation", /needs 1 integer/);
    expectIssue(doc, "hoppings[3]", /duplicate hopping/);
  });

  it("rejects a standard path whose lattice type does not fit and a citation for an unknown key", () => {
    const doc = raw("demo-diamond-sp3s");
    doc.kPath = { type: "standard", lattice: "bcc" };
    doc.provenance.citations["shell/X-X/2/ss_sigma"] = "typo";
    expectIssue(doc, "kPath.lattice", /do not form a bcc lattice/);
    expectIssue(doc, "provenance.citations.shell/X-X/2/ss_sigma", /no parameter/);
  });

  it("warns (without failing) about a parameter with no citation", () => {
    const doc = raw("demo-sp-chain");
    delete doc.provenance.citations["onsite/A/s"];
    const report = validateModelDocument(doc);
    expect(report.errors).toEqual([]);
    expect(report.warnings.map((w) => w.path)).toEqual(["provenance.citations.onsite/A/s"]);
  });

  it("parseModelDocument throws ModelDocumentError carrying every issue", () => {
    const doc = raw("demo-sp-chain");
    doc.version = 2;
    doc.electronCount = -1;
    try {
      parseModelDocument(doc);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ModelDocumentError);
      expect((e as ModelDocumentError).issues.map((i) => i.path).sort()).toEqual(["electronCount", "version"]);
    }
  });

  it("generates a JSON Schema that names every top-level field and forbids unknown ones", () => {
    const schema = modelDocumentJsonSchema() as { properties: Record<string, unknown>; required: string[]; additionalProperties: unknown };
    for (const key of Object.keys(raw("demo-diamond-sp3s"))) expect(schema.properties).toHaveProperty(key);
    expect(schema.required).toContain("conventions");
    expect(schema.additionalProperties).toBe(false);
  });
});
