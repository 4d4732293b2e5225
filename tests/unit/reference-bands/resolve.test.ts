import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseReferenceBands, ReferenceBandsError, resolveReferenceBands, type ParsedReferenceBands, type ReferenceIssue } from "@/lib/reference-bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";

const demo = (name: string) => parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));
const lines = (...rows: string[]) => rows.join("\n") + "\n";
const TWO_PI = 2 * Math.PI;

function resolveIssues(doc: ModelDocument, parsed: ParsedReferenceBands, pointsTotal?: number): ReferenceIssue[] {
  try {
    resolveReferenceBands(doc, parsed, pointsTotal);
  } catch (error) {
    expect(error).toBeInstanceOf(ReferenceBandsError);
    return (error as ReferenceBandsError).issues;
  }
  throw new Error("expected resolving to fail");
}

function tick(doc: ModelDocument, label: string, which: "first" | "last" = "first"): number[] {
  const path = samplePath(doc);
  const ticks = path.ticks.filter((t) => t.label === label);
  return path.kFrac[(which === "first" ? ticks[0] : ticks[ticks.length - 1]).index];
}

function expectClose(actual: number[], expected: number[], tol: number) {
  expect(actual).toHaveLength(expected.length);
  expected.forEach((x, i) => expect(Math.abs(actual[i] - x)).toBeLessThanOrEqual(tol));
}

describe("k_path distances on the chain (a = 2.5 Å)", () => {
  // The zone boundary of a line lattice with spacing a lies at π/a, reciprocal vector 2π/a
  // (Ashcroft and Mermin, Solid State Physics (1976), ch. 5 and 8; from memory).
  const doc = demo("demo-sp-chain");
  const a = 2.5;

  it("places a distance d on Γ–X at |k1| = d a / 2π, and the path end at the zone boundary", () => {
    const d = [0, Math.PI / (2 * a), Math.PI / a];
    const text = lines("k_path (1/angstrom),E1 (eV)", ...d.map((x) => `${x},0`));
    const r = resolveReferenceBands(doc, parseReferenceBands("ref.csv", text));
    expect(r.kFrac.map(([k]) => Math.abs(k))).toEqual([0, expect.closeTo(0.25, 14), expect.closeTo(0.5, 14)]);
    expect(r.distance).toEqual(d);
  });

  it("refuses a distance beyond the path end, naming the line; the end is at π/a", () => {
    const text = lines("k_path (1/angstrom),E1 (eV)", "0,1", "# beyond", `${(Math.PI / a) * 1.001},2`);
    const issues = resolveIssues(doc, parseReferenceBands("ref.csv", text));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ line: 4, column: 1 });
    const m = /^line 4, column 1 \(k_path \(1\/angstrom\)\): k outside the path: distance [\d.]+ 1\/Å is beyond the path's end at ([\d.]+) 1\/Å$/.exec(issues[0].message);
    expect(m).not.toBeNull();
    expect(Number(m![1])).toBeCloseTo(Math.PI / a, 12);
  });

  it("accepts 1/nm: 10 per nm is 1 per Å", () => {
    const r = resolveReferenceBands(doc, parseReferenceBands("r.csv", lines("k_path (1/nm),E1 (eV)", "0,0", `${(10 * Math.PI) / a},0`)));
    expect(Math.abs(r.kFrac[1][0])).toBeCloseTo(0.5, 12);
  });
});

describe("the honeycomb path Γ–M–K–Γ (a = 2.46 Å)", () => {
  // Hexagonal zone: |ΓM| = 2π/(√3 a), |MK| = 2π/(3a), |KΓ| = 4π/(3a), |b| = 4π/(√3 a), b1 and b2 at 120°
  // (Setyawan and Curtarolo, Comput. Mater. Sci. 49, 299 (2010), HEX; Ashcroft and Mermin ch. 5; from memory).
  const doc = demo("demo-honeycomb-pz");
  const a = 2.46;
  const gm = TWO_PI / (Math.sqrt(3) * a), mk = TWO_PI / (3 * a), kg = (4 * Math.PI) / (3 * a);

  it("interpolates linearly within a leg: halfway along M–K is (M + K)/2", () => {
    const text = lines("k_path (1/angstrom),E1 (eV)", `${gm},0`, `${gm + mk / 2},0`, `${gm + mk + kg},0`);
    const r = resolveReferenceBands(doc, parseReferenceBands("r.csv", text));
    const m = tick(doc, "M"), k = tick(doc, "K");
    // the document's vectors carry six digits, so the analytic distances agree to about 1e-6
    expectClose(r.kFrac[0], m, 1e-5);
    expectClose(r.kFrac[1], m.map((x, i) => (x + k[i]) / 2), 1e-5);
    expectClose(r.kFrac[2], [0, 0], 1e-5);
  });

  it("measures fractional points off the path along their own polyline", () => {
    const text = lines("k1,k2,E1 (eV)", "0,0,1", "0.1,0.05,1", "0.2,0,1");
    const r = resolveReferenceBands(doc, parseReferenceBands("r.csv", text));
    const b = (4 * Math.PI) / (Math.sqrt(3) * a);
    const step = (f1: number, f2: number) => b * Math.sqrt(f1 * f1 + f2 * f2 - f1 * f2);
    expectClose(r.distance, [0, step(0.1, 0.05), step(0.1, 0.05) + step(0.1, -0.05)], 1e-5);
    expect(r.kFrac).toEqual([[0, 0], [0.1, 0.05], [0.2, 0]]);
  });

  it("refuses fractional points of the wrong dimension", () => {
    const issues = resolveIssues(doc, parseReferenceBands("r.csv", lines("k1,k2,k3,E1 (eV)", "0,0,0,1")));
    expect(issues).toEqual([{ line: 2, column: 1, message: "line 2, column 1 (k1): the file gives 3 fractional coordinate(s) per point but the model's lattice is 2-dimensional" }]);
  });
});

describe("the fcc path's jump K|U (diamond demo, a = 5.5 Å)", () => {
  // Cubic coordinates in units of 2π/a: Γ 0, X (0,1,0), W (1/2,1,0), K (3/4,3/4,0), L (1/2,1/2,1/2), U (1/4,1,1/4)
  // (Setyawan and Curtarolo 2010, FCC; from memory). Run Γ-X-W-K-Γ-L-U-W-L-K has length
  // (2π/a)(1 + 1/2 + √2/4 + 3√2/4 + √3/2 + √6/4 + √2/4 + √2/2 + √6/4); the run U-X adds (2π/a)√2/4.
  const doc = demo("demo-diamond-sp3s");
  const unit = TWO_PI / 5.5;
  const jump = unit * (1.5 + 1.75 * Math.SQRT2 + Math.sqrt(3) / 2 + Math.sqrt(6) / 2);
  const end = jump + (unit * Math.SQRT2) / 4;

  it("a distance given twice at the jump is K (end of the first run), then U (start of the second)", () => {
    const text = lines("k_path (1/angstrom),E1 (eV)", "0,0", `${jump},1`, `${jump},2`, `${end},3`);
    const r = resolveReferenceBands(doc, parseReferenceBands("r.csv", text));
    expectClose(r.kFrac[1], tick(doc, "K", "last"), 1e-9);
    expectClose(r.kFrac[2], tick(doc, "U"), 1e-9);
    expectClose(r.kFrac[3], tick(doc, "X", "last"), 1e-9);
    expect(r.energies.map((row) => row[0])).toEqual([0, 1, 2, 3]);
  });

  it("a distance given twice elsewhere is a duplicate k", () => {
    const text = lines("k_path (1/angstrom),E1 (eV)", "0,0", "0.5,1", "0.5,2");
    expect(resolveIssues(doc, parseReferenceBands("r.csv", text))).toEqual([
      { line: 4, column: 1, message: "line 4, column 1 (k_path (1/angstrom)): duplicate k: distance 0.5 repeats line 3, and a distance may repeat only where the path jumps (it jumps only at K|U)" },
    ]);
  });

  it("an index past the sampled path is outside the path, for the document's sampling and for another", () => {
    const text = lines("k_index,E1 (eV)", "0,1", "36,1", "37,1", "239,1", "240,1");
    const parsed = parseReferenceBands("r.csv", text);
    expect(resolveIssues(doc, parsed)).toEqual([
      { line: 6, column: 1, message: "line 6, column 1 (k_index): k outside the path: index 240 is not among the path's 240 points (0–239)" },
    ]);
    expect(resolveIssues(doc, parsed, 37).map((i) => i.line)).toEqual([4, 5, 6]);
  });

  it("hand-built values without sources are named by point number", () => {
    const parsed: ParsedReferenceBands = { kKind: "index", k: [[0], [999]], energies: [[1], [2]], fermiLevel: null, bandCount: 1, pointCount: 2 };
    expect(resolveIssues(doc, parsed)).toEqual([
      { message: "point 2: k outside the path: index 999 is not among the path's 240 points (0–239)" },
    ]);
  });
});
