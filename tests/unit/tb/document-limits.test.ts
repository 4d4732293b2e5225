import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { basisSize } from "@/lib/tb/basis";
import { validateModelDocument } from "@/lib/tb/document";
import { BOND_SEARCH_BUDGET } from "@/lib/tb/document-validate";
import { gridModel } from "../../support/grid-model";

const raw = (name: string) => JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8"));

describe("what a model document may cost", () => {
  it("counts the basis as orbitals per cell, doubled with spin–orbit", () => {
    expect(basisSize(raw("demo-sp-chain"))).toBe(2);
    expect(basisSize(raw("demo-diamond-sp3s"))).toBe(10);
    expect(basisSize(gridModel([1, 1, 5], { spinOrbit: true }))).toBe(40); // the size of a two-site sp3d5s* model with spin–orbit
    expect(basisSize(gridModel([2, 2, 4]))).toBe(64);
  });

  it("refuses a basis over the limit before checking its meaning, with one message naming both numbers", () => {
    const report = validateModelDocument(gridModel([1, 1, 5], { spinOrbit: true }), { maxBasis: 32 });
    expect(report.document).toBeNull();
    expect(report.oversize).toEqual({ basis: 40, limit: 32 });
    expect(report.errors).toEqual([{ path: "sites", message: "The model's basis has 40 states (20 orbitals per cell, doubled by spin–orbit); this Bandgate accepts models of at most 32 states." }]);
    expect(validateModelDocument(gridModel([1, 1, 5], { spinOrbit: true }), { maxBasis: 40 }).document).not.toBeNull();
    // Sites that repeat an orbital count as listed: the limit is checked before the semantic checks that refuse them.
    const padded = { ...raw("demo-sp-chain"), sites: [{ label: "A1", species: "A", position: [0, 0, 0], orbitals: new Array(5000).fill("s") }] };
    expect(validateModelDocument(padded, { maxBasis: 64 }).oversize).toEqual({ basis: 5000, limit: 64 });
  });

  it("refuses a neighbour shell far beyond the cell instead of searching for it", () => {
    const doc = raw("demo-diamond-sp3s");
    doc.shells[0].distance = 5000;
    const errors = validateModelDocument(doc).errors.filter((e) => e.path === "shells[0].distance");
    expect(errors).toHaveLength(1);
    expect(errors[0].message).toMatch(new RegExp(`^shell distance 5000 Å reaches too far for this cell: finding its neighbours would compare [\\d,]+ site pairs, and a document's shells may compare at most ${BOND_SEARCH_BUDGET.toLocaleString("en-US")} together$`));
    // A shell that matches no neighbour but is within reach still gets the nearest distances as a hint.
    const near = raw("demo-diamond-sp3s");
    near.shells[0].distance = 2.5;
    expect(validateModelDocument(near).errors.find((e) => e.path === "shells[0].distance")?.message).toMatch(/nearest distances: 2\.3816/);
  });

  it("bounds the default path: at most 20,000 points and 64 labels", () => {
    const chain = raw("demo-sp-chain");
    expect(validateModelDocument({ ...chain, kPath: { ...chain.kPath, pointsTotal: 20_000 } }).errors).toEqual([]);
    expect(validateModelDocument({ ...chain, kPath: { ...chain.kPath, pointsTotal: 20_001 } }).errors.map((e) => e.path)).toEqual(["kPath.pointsTotal"]);
    const labels = Array.from({ length: 65 }, (_, i) => `P${i}`);
    const custom = { type: "custom", points: Object.fromEntries(labels.map((l, i) => [l, [i / 200]])), segments: [labels] };
    expect(validateModelDocument({ ...chain, kPath: custom }).errors.map((e) => e.path).sort()).toEqual(["kPath.points", "kPath.segments[0]"]);
  });
});
