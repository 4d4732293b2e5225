import { describe, expect, it } from "vitest";
import { parseReferenceBands, REFERENCE_LIMITS, ReferenceBandsError, type ReferenceIssue } from "@/lib/reference-bands";

function issuesOf(text: string, fileName = "ref.csv"): ReferenceIssue[] {
  try {
    parseReferenceBands(fileName, text);
  } catch (error) {
    expect(error).toBeInstanceOf(ReferenceBandsError);
    return (error as ReferenceBandsError).issues;
  }
  throw new Error("expected the file to be refused");
}

const lines = (...rows: string[]) => rows.join("\n") + "\n";

describe("CSV errors name line and column", () => {
  it("a non-number, counting comment and blank lines (lines are 1-based)", () => {
    const comments = Array.from({ length: 10 }, (_, i) => (i % 3 === 0 ? "" : `# comment ${i}`));
    const text = lines(...comments, "k_index,E1 (eV),E2 (eV)", "0,1.0,2.0", "1,1.5,2.5", "2,1.7,abc");
    expect(issuesOf(text)).toEqual([{ line: 14, column: 3, message: "line 14, column 3 (E2 (eV)): 'abc' is not a number" }]);
  });

  it("a NUL character anywhere, even in a comment, with its line and column", () => {
    const text = lines("# written by hand \u0000", "k_index,E1 (eV)", "0,1.0");
    expect(issuesOf(text)).toEqual([{ line: 1, column: 19, message: "line 1, column 19: the file holds a NUL character (U+0000); save it as plain UTF-8 text" }]);
    expect(issuesOf(lines("k_index,E1 (eV)", "0,1.\u00000"))[0]).toMatchObject({ line: 2, column: 5 });
  });

  it.each([
    ["NaN", "'NaN' is not allowed: values must be finite numbers (no NaN or Infinity)"],
    ["Infinity", "'Infinity' is not allowed: values must be finite numbers (no NaN or Infinity)"],
    ["-inf", "'-inf' is not allowed: values must be finite numbers (no NaN or Infinity)"],
    ["1e400", "'1e400' is too large to be a finite number"],
    ["1,5", null],
    ["0x1F", "'0x1F' is not a number"],
    ["1.2.3", "'1.2.3' is not a number"],
  ])("the energy cell %s", (cell, message) => {
    const text = lines("k_index,E1 (eV)", "0,1", `1,${cell}`);
    if (message === null) {
      expect(issuesOf(text)).toEqual([{ line: 3, column: 3, message: "line 3, column 3: wrong number of cells: expected 2 as in the header (line 1), found 3" }]);
    } else {
      expect(issuesOf(text)).toEqual([{ line: 3, column: 2, message: `line 3, column 2 (E1 (eV)): ${message}` }]);
    }
  });

  it("a row with too few cells, and an empty k cell", () => {
    const text = lines("k_path (1/angstrom),E1 (eV),E2 (eV)", "0,1,2", "0.1,1", ",1,2");
    expect(issuesOf(text)).toEqual([
      { line: 3, column: 3, message: "line 3, column 3 (E2 (eV)): wrong number of cells: expected 3 as in the header (line 1), found 2" },
      { line: 4, column: 1, message: "line 4, column 1 (k_path (1/angstrom)): k value missing: k cells must not be empty" },
    ]);
  });

  it("missing units", () => {
    expect(issuesOf(lines("k_index,E1 (eV),E2", "0,1,2"))).toEqual([
      { line: 1, column: 3, message: "line 1, column 3 (E2): missing unit: write e.g. 'E2 (eV)' (eV, meV, Ry or Hartree)" },
    ]);
    expect(issuesOf(lines("# header next", "k_path,E1 (eV)", "0,1"))).toEqual([
      { line: 2, column: 1, message: "line 2, column 1 (k_path): missing unit: k_path needs one, e.g. 'k_path (1/angstrom)'" },
    ]);
  });

  it("unknown units; 'MeV' is not 'meV'", () => {
    expect(issuesOf(lines("k_index,E1 (kcal/mol),band_2 [MeV]", "0,1,2"))).toEqual([
      { line: 1, column: 2, message: "line 1, column 2 (E1 (kcal/mol)): unknown unit 'kcal/mol' (expected eV, meV, Ry or Hartree)" },
      { line: 1, column: 3, message: "line 1, column 3 (band_2 [MeV]): unknown unit 'MeV' (expected eV, meV, Ry or Hartree)" },
    ]);
    expect(issuesOf(lines("k_path (1/furlong),E1 (eV)", "0,1"))).toEqual([
      { line: 1, column: 1, message: "line 1, column 1 (k_path (1/furlong)): unknown unit '1/furlong' for k_path (expected 1/angstrom, 1/nm or 1/bohr)" },
    ]);
    expect(issuesOf(lines("k1 (1/angstrom),E1 (eV)", "0,1"))[0].message).toBe(
      "line 1, column 1 (k1 (1/angstrom)): unknown unit '1/angstrom' for k1: fractional coordinates take no unit (or '(fractional)')",
    );
  });

  it("header columns that are not a k coordinate or a numbered band", () => {
    expect(issuesOf(lines("kpoint,E1 (eV)", "0,1"))).toEqual([
      { line: 1, column: 1, message: "line 1, column 1 (kpoint): the first column must name the k coordinate: k_index, k_path (unit) or k1, k2, k3; found 'kpoint'" },
    ]);
    expect(issuesOf(lines("k_index,E1 (eV),E3 (eV),weight (eV)", "0,1,2,3"))).toEqual([
      { line: 1, column: 3, message: "line 1, column 3 (E3 (eV)): bands must be numbered 1, 2, 3… in column order: expected band 2 here, found 3" },
      { line: 1, column: 4, message: "line 1, column 4 (weight (eV)): not a band column: expected 'E3 (eV)' or 'band_3 [eV]'" },
    ]);
    expect(issuesOf(lines("k_index", "0"))).toEqual([{ line: 1, message: "line 1: no band columns after the k column(s); add e.g. 'E1 (eV)'" }]);
  });

  it("duplicate k: a repeated index, a fractional point on consecutive rows, a distance three times", () => {
    expect(issuesOf(lines("k_index,E1 (eV)", "0,1", "1,1", "# again", "0,2"))).toEqual([
      { line: 5, column: 1, message: "line 5, column 1 (k_index): duplicate k: index 0 is already on line 2" },
    ]);
    expect(issuesOf(lines("k1,k2,E1 (eV)", "0,0,1", "0.1,0,1", "0.1,0,2"))).toEqual([
      { line: 4, column: 1, message: "line 4, column 1 (k1): duplicate k: the point (0.1, 0) repeats line 3" },
    ]);
    expect(issuesOf(lines("k_path (1/angstrom),E1 (eV)", "0,1", "0.5,1", "0.5,2", "0.5,3"))).toEqual([
      { line: 5, column: 1, message: "line 5, column 1 (k_path (1/angstrom)): duplicate k: distance 0.5 already appears twice, on line 3 and line 4" },
    ]);
  });

  it("non-increasing k_path, negative distances and indices that are not whole numbers", () => {
    expect(issuesOf(lines("k_path (1/angstrom),E1 (eV)", "0,1", "0.5,1", "0.4,2"))).toEqual([
      { line: 4, column: 1, message: "line 4, column 1 (k_path (1/angstrom)): non-increasing k_path: 0.4 comes after 0.5 on line 3; distances along the path must increase" },
    ]);
    expect(issuesOf(lines("k_path (1/angstrom),E1 (eV)", "-0.1,1"))[0].message).toBe(
      "line 2, column 1 (k_path (1/angstrom)): k_path must not be negative, found -0.1",
    );
    expect(issuesOf(lines("k_index,E1 (eV)", "0,1", "1.5,1", "-2,1"))).toEqual([
      { line: 3, column: 1, message: "line 3, column 1 (k_index): k_index must be a whole number ≥ 0, found 1.5" },
      { line: 4, column: 1, message: "line 4, column 1 (k_index): k_index must be a whole number ≥ 0, found -2" },
    ]);
  });

  it("files with no header, no data, or an unclosed quote", () => {
    expect(issuesOf("# only a comment\n\n")).toEqual([{ message: "the file has no header row (only blank or '#' comment lines)" }]);
    expect(issuesOf(lines("k_index,E1 (eV)", "# nothing yet"))).toEqual([{ line: 1, message: "line 1: the header has no data rows below it" }]);
    expect(issuesOf(lines("k_index,E1 (eV)", '0,"1'))).toEqual([{ line: 2, message: "line 2: a quoted cell is not closed" }]);
  });

  it("limits: rows, band columns, bytes (exported as REFERENCE_LIMITS)", () => {
    expect(REFERENCE_LIMITS).toEqual({ maxBytes: 5 * 1024 * 1024, maxRows: 20_000, maxBands: 500 });
    const rows = Array.from({ length: 20_001 }, (_, i) => `${i},1`);
    expect(issuesOf(lines("k_index,E1 (eV)", ...rows))).toEqual([{ line: 20_002, message: "line 20002: too many rows: the limit is 20000 data rows" }]);
    expect(parseReferenceBands("ok.csv", lines("k_index,E1 (eV)", ...rows.slice(0, 20_000))).pointCount).toBe(20_000);
    const wide = (n: number) => ["k_index", ...Array.from({ length: n }, (_, b) => `E${b + 1} (eV)`)].join(",");
    expect(issuesOf(lines(wide(501), "0"))).toEqual([{ line: 1, column: 502, message: "line 1, column 502 (E501 (eV)): too many columns: 501 band columns, the limit is 500" }]);
    expect(parseReferenceBands("ok.csv", lines(wide(500), ["0", ...new Array(500).fill("1")].join(","))).bandCount).toBe(500);
    const big = lines("k_index,E1 (eV)", "0,1") + "#".repeat(5 * 1024 * 1024);
    // ASCII only, so bytes = characters
    expect(issuesOf(big)).toEqual([{ message: `the file is too large: ${big.length} bytes, the limit is 5242880 bytes (5 MiB)` }]);
    // "Å" takes two bytes in UTF-8: the limit is on bytes, not characters
    const wideChars = "k_index,E1 (eV)\n0,1\n#" + "Å".repeat(2_700_000);
    expect(wideChars.length).toBeLessThan(5 * 1024 * 1024);
    expect(issuesOf(wideChars)[0].message).toMatch(/^the file is too large: 5400021 bytes/);
  });

  it("collects several problems at once, and stops at 50", () => {
    const bad = Array.from({ length: 80 }, (_, i) => `${i},x`);
    const issues = issuesOf(lines("k_index,E1 (eV)", ...bad));
    expect(issues).toHaveLength(50);
    expect(issues[49]).toEqual({ line: 51, column: 2, message: "line 51, column 2 (E1 (eV)): 'x' is not a number" });
  });
});

describe("CSV forms that are accepted", () => {
  it("CRLF line ends, a byte-order mark, quoted headers, spaces around cells, empty cells as missing values", () => {
    const text = '\uFEFFk_index , "E1 (eV)", "band_2 [meV]"\r\n0, -1.5 ,\r\n 1,,250\r\n';
    const parsed = parseReferenceBands("ref.csv", text);
    expect(parsed.k).toEqual([[0], [1]]);
    expect(parsed.energies).toEqual([[-1.5, null], [null, 0.25]]);
  });

  it("picks JSON by the .json extension or a leading '{', CSV otherwise", () => {
    expect(issuesOf("k_index,E1 (eV)\n0,1\n", "bands.json")[0].message).toMatch(/not valid JSON/);
    expect(issuesOf('  {"format": "x"}', "bands.csv")[0].path).toBe("format");
  });
});
