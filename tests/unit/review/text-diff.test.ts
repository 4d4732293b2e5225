import { describe, expect, it } from "vitest";
import { collapseUnchanged, diffCanonicalText, sideBySide, type TextDiffLine } from "@/lib/review/text-diff";
import { canonicalJson } from "@/lib/tb/canonical";
import { setParameters } from "@/lib/tb/parameters";
import { zincBlendeDocument } from "../tb/analysis/documents";

// Expected line lists are the shortest edit scripts, worked out by hand; each input has a single shortest script
// (E. W. Myers, "An O(ND) difference algorithm and its variations", Algorithmica 1, 251 (1986)).

const same = (text: string, oldNo: number, newNo: number): TextDiffLine => ({ kind: "same", oldNo, newNo, text });
const removed = (text: string, oldNo: number): TextDiffLine => ({ kind: "removed", oldNo, newNo: null, text });
const added = (text: string, newNo: number): TextDiffLine => ({ kind: "added", oldNo: null, newNo, text });

describe("canonical text diff", () => {
  it("removes one line and adds another with line numbers on each side", () => {
    expect(diffCanonicalText("a\nb\nc\nd", "a\nc\nd\ne")).toEqual([same("a", 1, 1), removed("b", 2), same("c", 3, 2), same("d", 4, 3), added("e", 4)]);
  });

  it("lists a replaced run as its removed lines, then its added lines", () => {
    expect(diffCanonicalText("x\ny1\ny2\nz", "x\nY\nz")).toEqual([same("x", 1, 1), removed("y1", 2), removed("y2", 3), added("Y", 2), same("z", 4, 3)]);
  });

  it("does not call an unterminated last line changed when lines follow it, and reads an empty text as no lines", () => {
    expect(diffCanonicalText("a\nb", "a\nb\nc\n")).toEqual([same("a", 1, 1), same("b", 2, 2), added("c", 3)]);
    expect(diffCanonicalText("", "p\nq")).toEqual([added("p", 1), added("q", 2)]);
    expect(diffCanonicalText("p", "")).toEqual([removed("p", 1)]);
    expect(diffCanonicalText("", "")).toEqual([]);
  });

  it("finds the one changed value in the pretty canonical form of two documents", () => {
    const base = zincBlendeDocument();
    const before = canonicalJson(base, { pretty: true });
    const after = canonicalJson(setParameters(base, { "shell/A-B/1/pp_pi": -0.9 }), { pretty: true });
    const changed = diffCanonicalText(before, after).filter((l) => l.kind !== "same");
    const at = before.split("\n").findIndex((l) => l.includes('"pp_pi"'));
    expect(at).toBeGreaterThan(0);
    expect(changed).toEqual([removed(before.split("\n")[at], at + 1), added(before.split("\n")[at].replace("-0.8", "-0.9"), at + 1)]);
    expect(changed[0].text.trim()).toBe('"pp_pi": -0.8,');
  });
});

describe("side-by-side pairing", () => {
  it("pairs removed lines with the added lines that follow, unchanged lines with themselves", () => {
    const lines = [same("a", 1, 1), removed("b", 2), removed("c", 3), added("B", 2), same("d", 4, 3), added("e", 4), removed("f", 5)];
    expect(sideBySide(lines)).toEqual([
      { left: lines[0], right: lines[0] },
      { left: lines[1], right: lines[3] },
      { left: lines[2], right: null },
      { left: lines[4], right: lines[4] },
      { left: null, right: lines[5] },
      { left: lines[6], right: null },
    ]);
  });
});

describe("collapsing unchanged runs", () => {
  it("keeps three lines of context around a change and hides longer unchanged runs", () => {
    const rows = Array.from({ length: 20 }, (_, i) => (i === 10 ? "changed" : "same"));
    const parts = collapseUnchanged(rows, (r) => r === "same");
    expect(parts).toEqual([
      { kind: "hidden", start: 0, count: 7 },
      { kind: "rows", start: 7, rows: rows.slice(7, 14) },
      { kind: "hidden", start: 14, count: 6 },
    ]);
  });

  it("shows a short unchanged run between two changes instead of hiding it", () => {
    const rows = ["c", "s", "s", "s", "s", "s", "s", "s", "s", "s", "c"];
    expect(collapseUnchanged(rows, (r) => r === "s")).toEqual([{ kind: "rows", start: 0, rows }]);
    const wide = ["c", ...new Array<string>(12).fill("s"), "c"];
    expect(collapseUnchanged(wide, (r) => r === "s")).toEqual([
      { kind: "rows", start: 0, rows: wide.slice(0, 4) },
      { kind: "hidden", start: 4, count: 6 },
      { kind: "rows", start: 10, rows: wide.slice(10) },
    ]);
  });
});
