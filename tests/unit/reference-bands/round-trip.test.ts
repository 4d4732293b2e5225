import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseReferenceBands, resolveReferenceBands } from "@/lib/reference-bands";
import { compareWithReference } from "@/lib/tb/analysis/compare-reference";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";

// CODATA 2018 (Tiesinga, Mohr, Newell, Taylor, Rev. Mod. Phys. 93, 025010 (2021)): Rydberg energy, Hartree
// energy and Bohr radius, typed here so the conversion is checked against the published values, not the module's.
const RY_EV = 13.605693122994;
const HARTREE_EV = 27.211386245988;
const BOHR_ANGSTROM = 0.529177210903;

const demo = (name: string) => parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));

interface Original {
  doc: ModelDocument;
  kFrac: number[][];
  distance: number[];
  energies: (number | null)[][];
}

/** Bands of a demo model on its default path, with a few values removed as a reference file may lack them. */
function original(name: string, pointsTotal?: number): Original {
  const doc = demo(name);
  const path = samplePath(doc, pointsTotal);
  const bands = computeBands(compileModel(doc), path.kFrac).energies;
  const energies = bands.map((row, k) => Array.from(row, (e, n): number | null => ((k * 7 + n) % 23 === 5 ? null : e)));
  return { doc, kFrac: path.kFrac, distance: path.distance, energies };
}

function csv(header: string[], kCells: string[][], energies: (number | null)[][], scale: number): string {
  const lines = ["# reference bands written by the round-trip test", header.join(","), ""];
  energies.forEach((row, k) => {
    lines.push([...kCells[k], ...row.map((e) => (e === null ? "" : String(e / scale)))].join(","));
    if (k % 50 === 10) lines.push("# a comment between rows", "  ");
  });
  return lines.join("\n") + "\n";
}

function bandHeaders(count: number, unit: string, style: "E" | "band" = "E"): string[] {
  return Array.from({ length: count }, (_, n) => (style === "E" ? `E${n + 1} (${unit})` : `band_${n + 1} [${unit}]`));
}

function expectSameEnergies(actual: (number | null)[][], expected: (number | null)[][], relTol: number) {
  expect(actual).toHaveLength(expected.length);
  expected.forEach((row, k) =>
    row.forEach((e, n) => {
      if (e === null) expect(actual[k][n]).toBeNull();
      else expect(Math.abs((actual[k][n] as number) - e)).toBeLessThanOrEqual(relTol * Math.max(1, Math.abs(e)));
    }),
  );
}

function expectSamePoints(actual: number[][], expected: number[][], tol: number) {
  expect(actual).toHaveLength(expected.length);
  expected.forEach((k, i) => k.forEach((x, c) => expect(Math.abs(actual[i][c] - x)).toBeLessThanOrEqual(tol)));
}

/** The model evaluated at the resolved points must reproduce the file's energies: RMS ≈ 0 with no alignment. */
function expectModelAgrees(o: Original, kFrac: number[][], energies: (number | null)[][]) {
  const model = computeBands(compileModel(o.doc), kFrac).energies.map((row) => Array.from(row));
  const result = compareWithReference(model, { kFrac, energies }, { alignment: "none" });
  expect(result.points).toBe(o.energies.flat().filter((e) => e !== null).length);
  expect(result.maxAbs).toBeLessThan(1e-9);
}

describe.each(["demo-sp-chain", "demo-honeycomb-pz", "demo-diamond-sp3s"])("round trip of %s's bands", (name) => {
  const o = original(name);
  const bandCount = o.energies[0].length;
  const dim = o.doc.lattice.dimension;

  it("CSV by k_index in eV", () => {
    const text = csv(["k_index", ...bandHeaders(bandCount, "eV")], o.kFrac.map((_, i) => [String(i)]), o.energies, 1);
    const parsed = parseReferenceBands("ref.csv", text);
    expect(parsed).toMatchObject({ kKind: "index", bandCount, pointCount: o.kFrac.length, fermiLevel: null });
    const r = resolveReferenceBands(o.doc, parsed);
    expect(r.kFrac).toEqual(o.kFrac);
    expect(r.distance).toEqual(o.distance);
    expectSameEnergies(r.energies, o.energies, 0);
    expectModelAgrees(o, r.kFrac, r.energies);
  });

  it("CSV by k_path in 1/angstrom with energies in Ry", () => {
    const text = csv(["k_path (1/angstrom)", ...bandHeaders(bandCount, "Ry")], o.distance.map((d) => [String(d)]), o.energies, RY_EV);
    const r = resolveReferenceBands(o.doc, parseReferenceBands("ref.csv", text));
    expectSamePoints(r.kFrac, o.kFrac, 1e-12);
    expect(r.distance).toEqual(o.distance);
    expectSameEnergies(r.energies, o.energies, 1e-14);
    expectModelAgrees(o, r.kFrac, r.energies);
  });

  it("CSV by k_path in 1/bohr, band_n [meV] headers", () => {
    const kCells = o.distance.map((d) => [String(d * BOHR_ANGSTROM)]);
    const text = csv(["k_path (1/bohr)", ...bandHeaders(bandCount, "meV", "band")], kCells, o.energies, 1e-3);
    const r = resolveReferenceBands(o.doc, parseReferenceBands("ref.txt", text));
    expectSamePoints(r.kFrac, o.kFrac, 1e-12);
    r.distance.forEach((d, i) => expect(Math.abs(d - o.distance[i])).toBeLessThan(1e-12));
    expectSameEnergies(r.energies, o.energies, 1e-14);
  });

  it("CSV by fractional k1…kd in Hartree", () => {
    const header = [...["k1", "k2", "k3"].slice(0, dim), ...bandHeaders(bandCount, "Hartree")];
    const text = csv(header, o.kFrac.map((k) => k.map(String)), o.energies, HARTREE_EV);
    const parsed = parseReferenceBands("ref.csv", text);
    expect(parsed.kKind).toBe("fractional");
    const r = resolveReferenceBands(o.doc, parsed);
    expect(r.kFrac).toEqual(o.kFrac);
    // the points follow the default path, so they are placed on it (the fcc path's jump K|U adds no length)
    r.distance.forEach((d, i) => expect(Math.abs(d - o.distance[i])).toBeLessThan(1e-9));
    expectSameEnergies(r.energies, o.energies, 1e-14);
    expectModelAgrees(o, r.kFrac, r.energies);
  });

  it.each(["index", "path", "fractional"] as const)("JSON with k.kind %s", (kind) => {
    const values = kind === "index" ? o.kFrac.map((_, i) => i) : kind === "path" ? o.distance : o.kFrac;
    const scaled = o.energies.map((row) => row.map((e) => (e === null ? null : e / HARTREE_EV)));
    const json = { format: "bandgate-reference-bands", version: 1, energyUnit: "Hartree", k: { kind, values }, energies: scaled, fermiLevel: 0.25 };
    const parsed = parseReferenceBands("upload", JSON.stringify(json, null, 1));
    expect(parsed.kKind).toBe(kind);
    expect(parsed.fermiLevel).toBeCloseTo(0.25 * HARTREE_EV, 12);
    const r = resolveReferenceBands(o.doc, parsed);
    expectSamePoints(r.kFrac, o.kFrac, 1e-12);
    expectSameEnergies(r.energies, o.energies, 1e-14);
    expectModelAgrees(o, r.kFrac, r.energies);
  });
});

describe("sampling other than the document's", () => {
  it("k_index and k_path files written on 37 points resolve onto samplePath(doc, 37)", () => {
    const o = original("demo-diamond-sp3s", 37);
    const n = o.energies[0].length;
    const byIndex = csv(["k_index", ...bandHeaders(n, "eV")], o.kFrac.map((_, i) => [String(i)]), o.energies, 1);
    expect(resolveReferenceBands(o.doc, parseReferenceBands("a.csv", byIndex), 37).kFrac).toEqual(o.kFrac);
    const byPath = csv(["k_path (1/Å)", ...bandHeaders(n, "eV")], o.distance.map((d) => [d.toPrecision(12)]), o.energies, 1);
    // the distance does not depend on the sampling, so no pointsTotal is needed; 12 digits give ~1e-11 in k
    expectSamePoints(resolveReferenceBands(o.doc, parseReferenceBands("a.csv", byPath)).kFrac, o.kFrac, 1e-10);
  });
});
