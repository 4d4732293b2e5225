import { describe, expect, it } from "vitest";
import { parseReferenceBands, ReferenceBandsError, type ReferenceIssue } from "@/lib/reference-bands";

function issuesOf(value: unknown): ReferenceIssue[] {
  const text = typeof value === "string" ? value : JSON.stringify(value);
  try {
    parseReferenceBands("ref.json", text);
  } catch (error) {
    expect(error).toBeInstanceOf(ReferenceBandsError);
    return (error as ReferenceBandsError).issues;
  }
  throw new Error("expected the file to be refused");
}

const valid = () => ({
  format: "bandgate-reference-bands",
  version: 1,
  energyUnit: "eV",
  k: { kind: "index", values: [0, 1, 2] as unknown[] },
  energies: [[1, 2], [1.5, null], [2, 3]] as unknown[][],
});

describe("JSON errors name the JSON path", () => {
  it("a valid file parses, with nulls kept and no Fermi level", () => {
    expect(parseReferenceBands("ref.json", JSON.stringify(valid()))).toMatchObject({
      kKind: "index", k: [[0], [1], [2]], energies: [[1, 2], [1.5, null], [2, 3]], fermiLevel: null, bandCount: 2, pointCount: 3,
    });
  });

  it("a non-number energy, a non-whole index, an infinite Fermi level (1e400 overflows in JSON.parse)", () => {
    const doc = valid();
    doc.energies[2][1] = "abc";
    doc.k.values[1] = 1.5;
    const text = JSON.stringify(doc).replace(/}$/, ',"fermiLevel":1e400}');
    expect(issuesOf(text)).toEqual([
      { path: "k.values[1]", message: "k.values[1]: must be a whole number" },
      { path: "energies[2][1]", message: "energies[2][1]: must be a finite number" },
      { path: "fermiLevel", message: "fermiLevel: must be a finite number" },
    ]);
  });

  it("wrong format, version, unit, kind and an unknown key", () => {
    const doc = { ...valid(), format: "bands", version: 2, energyUnit: "MeV", k: { kind: "cartesian", values: [] }, extra: 1 };
    expect(issuesOf(doc)).toEqual([
      { path: "format", message: 'format: must be "bandgate-reference-bands"' },
      { path: "version", message: "version: must be 1" },
      { path: "energyUnit", message: "energyUnit: must be one of eV, meV, Ry, Hartree" },
      { path: "k.kind", message: 'k.kind: must be "index", "path" or "fractional"' },
      { path: "(top level)", message: '(top level): Unrecognized key: "extra"' },
    ]);
  });

  it("row counts and widths that do not match", () => {
    expect(issuesOf({ ...valid(), energies: [[1, 2], [1, 2]] })).toEqual([
      { path: "energies", message: "energies: expected one row per k-point (3), found 2" },
    ]);
    expect(issuesOf({ ...valid(), energies: [[1, 2], [1], [1, 2, 3]] })).toEqual([
      { path: "energies[1]", message: "energies[1]: expected 2 values as in energies[0], found 1" },
      { path: "energies[2]", message: "energies[2]: expected 2 values as in energies[0], found 3" },
    ]);
    const frac = { ...valid(), k: { kind: "fractional", values: [[0, 0], [0.1, 0], [0.2]] } };
    expect(issuesOf(frac)).toEqual([{ path: "k.values[2]", message: "k.values[2]: expected 2 coordinates as in k.values[0], found 1" }]);
  });

  it("duplicate k and non-increasing path distances", () => {
    expect(issuesOf({ ...valid(), k: { kind: "index", values: [0, 2, 2] } })).toEqual([
      { path: "k.values[2]", message: "k.values[2]: duplicate k: index 2 is already on k.values[1]" },
    ]);
    expect(issuesOf({ ...valid(), k: { kind: "path", values: [0, 0.3, 0.2] } })).toEqual([
      { path: "k.values[2]", message: "k.values[2]: non-increasing k_path: 0.2 comes after 0.3 on k.values[1]; distances along the path must increase" },
    ]);
    expect(issuesOf({ ...valid(), k: { kind: "path", values: [0, -0.3, 0.2] } })[0]).toEqual({ path: "k.values[1]", message: "k.values[1]: must be ≥ 0" });
  });

  it("limits on points and bands", () => {
    const n = 20_001;
    const many = { ...valid(), k: { kind: "index", values: Array.from({ length: n }, (_, i) => i) }, energies: Array.from({ length: n }, () => [1]) };
    expect(issuesOf(many)).toEqual([{ path: "k.values", message: "k.values: too many rows: 20001 points, the limit is 20000" }]);
    const wide = { ...valid(), k: { kind: "index", values: [0] }, energies: [new Array(501).fill(1)] };
    expect(issuesOf(wide)).toEqual([{ path: "energies[0]", message: "energies[0]: too many bands: 501, the limit is 500" }]);
  });

  it("a syntax error gives line and column of the offending character", () => {
    const text = '{\n  "format": "bandgate-reference-bands",\n  "version": 1,,\n}';
    const [issue] = issuesOf(text);
    expect(issue).toMatchObject({ line: 3, column: 16 });
    expect(issue.message).toMatch(/^line 3, column 16: not valid JSON: /);
  });
});
