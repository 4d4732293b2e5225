import { describe, expect, it } from "vitest";
import { buildParameterDiff, type ParamDiffRow } from "@/lib/review/param-diff";
import { groupParamRows, sortParamRows } from "@/lib/review/param-diff-sort";
import type { ModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";
import { sChainDocument, zincBlendeDocument } from "../tb/analysis/documents";

// Keyed parameter diff. Expected values are worked out by hand from the documents' invented demo values:
// Δ = proposed − base, %Δ = 100·Δ/|base| (undefined for a zero base), a sign flip when base and proposed have
// opposite signs.

const byKey = (rows: ParamDiffRow[]) => Object.fromEntries(rows.map((r) => [r.key, r]));
const edit = (doc: ModelDocument, change: (d: ModelDocument) => void) => {
  const next = structuredClone(doc);
  change(next);
  return next;
};

describe("keyed parameter diff: values", () => {
  it("lists only changed parameters with base, proposed, Δ, %Δ and the group of each", () => {
    const base = zincBlendeDocument();
    const proposed = setParameters(base, { "shell/A-B/1/pp_pi": -0.9, "onsite/B/s": -2.5 });
    const rows = byKey(buildParameterDiff(base, proposed).rows);
    expect(Object.keys(rows).sort()).toEqual(["onsite/B/s", "shell/A-B/1/pp_pi"]);
    expect(rows["shell/A-B/1/pp_pi"]).toMatchObject({ base: -0.8, proposed: -0.9, signFlip: false, label: "p–p π (pp_pi)" });
    expect(rows["shell/A-B/1/pp_pi"].delta).toBeCloseTo(-0.1, 12);
    expect(rows["shell/A-B/1/pp_pi"].percent).toBeCloseTo(-12.5, 10);
    // Shell distance a·√3/4 with a = 5.65 Å: 2.44652 Å.
    expect(rows["shell/A-B/1/pp_pi"].group).toBe("A–B shell 1 (2.447 Å)");
    expect(rows["onsite/B/s"]).toMatchObject({ group: "B on-site", label: "ε(s)", base: -2.7, proposed: -2.5 });
    expect(rows["onsite/B/s"].percent).toBeCloseTo((100 * 0.2) / 2.7, 10);
  });

  it("gives no percent for a zero base and flags a sign flip (but not a change from or to zero)", () => {
    const base = zincBlendeDocument({ pp_pi: -0.8 });
    const rows = byKey(buildParameterDiff(base, setParameters(base, { "shell/A-B/1/pp_pi": 0.8, "onsite/A/px": 0 })).rows);
    expect(rows["shell/A-B/1/pp_pi"]).toMatchObject({ signFlip: true, delta: 1.6 });
    expect(rows["shell/A-B/1/pp_pi"].percent).toBeCloseTo(200, 10);
    expect(rows["onsite/A/px"]).toMatchObject({ base: 1, proposed: 0, signFlip: false, percent: -100 });
    const fromZero = zincBlendeDocument({ pp_pi: 0 });
    const row = byKey(buildParameterDiff(fromZero, zincBlendeDocument({ pp_pi: 0.3 })).rows)["shell/A-B/1/pp_pi"];
    expect(row).toMatchObject({ base: 0, proposed: 0.3, percent: null, signFlip: false });
    expect(buildParameterDiff(base, base).rows).toEqual([]);
  });

  it("reports an identical document as identical, also when only the order of sites or hoppings differs", () => {
    const doc = zincBlendeDocument();
    expect(buildParameterDiff(doc, structuredClone(doc)).gauge.verdict).toBe("identical");
    // Reordering the basis permutes H(k) by a permutation matrix: same eigenvalues (a unitary similarity).
    const reordered = edit(doc, (d) => d.sites.reverse());
    const diff = buildParameterDiff(doc, reordered);
    expect(diff).toMatchObject({ rows: [], structural: [] });
    expect(diff.gauge.verdict).toBe("identical");
  });
});

describe("keyed parameter diff: structure", () => {
  it("lists added and removed parameters as such, without Δ or effect", () => {
    const base = zincBlendeDocument();
    const proposed = edit(base, (d) => {
      delete d.shells[0].params.pp_pi;
      d.spinOrbit = { A: 0.12 };
    });
    const rows = byKey(buildParameterDiff(base, proposed).rows);
    expect(rows["shell/A-B/1/pp_pi"]).toMatchObject({ base: -0.8, proposed: null, delta: null, percent: null, effect: null, effectMethod: null });
    expect(rows["soc/A"]).toMatchObject({ base: null, proposed: 0.12, group: "spin–orbit", label: "λ(A)", effect: null });
  });

  it("names added and removed orbitals, sites and shells", () => {
    const base = zincBlendeDocument();
    const proposed = edit(base, (d) => {
      d.sites[0].orbitals.push("s*");
      d.sites[1].orbitals = ["s", "px", "py"];
      d.onsite.A["s*"] = 6.5;
      d.sites.push({ label: "C1", species: "C", position: [1, 1, 1], orbitals: ["s"] });
      d.onsite.C = { s: 0.5 };
      d.shells.push({ species: ["A", "A"], index: 2, distance: 3.995, params: { ss_sigma: -0.1 } });
    });
    const diff = buildParameterDiff(base, proposed);
    expect(diff.structural).toEqual(expect.arrayContaining([
      { kind: "orbital-added", text: "orbital s* added on site A1 (A)" },
      { kind: "orbital-removed", text: "orbital pz removed from site B1 (B)" },
      { kind: "site-added", text: "site C1 (C) added at (1, 1, 1) Å with s" },
      { kind: "shell-added", text: "A–A shell 2 (3.995 Å) added" },
    ]));
    expect(diff.structural).toHaveLength(4);
    const rows = byKey(diff.rows);
    expect(rows["onsite/A/s*"]).toMatchObject({ base: null, proposed: 6.5, group: "A on-site" });
    expect(rows["shell/A-A/2/ss_sigma"]).toMatchObject({ base: null, proposed: -0.1, group: "A–A shell 2 (3.995 Å)" });
    expect(diff.gauge.verdict).toBe("physical change");
    const back = buildParameterDiff(proposed, base);
    expect(back.structural.map((s) => s.kind).sort()).toEqual(["orbital-added", "orbital-removed", "shell-removed", "site-removed"]);
  });

  it("reports geometry and electron-count changes", () => {
    const base = zincBlendeDocument();
    const proposed = edit(base, (d) => {
      d.lattice.vectors[0] = [0, 2.9, 2.9];
      d.sites[1].position = [1.5, 1.5, 1.5];
      d.shells[0].distance = 2.5;
      d.electronCount = 7;
    });
    const diff = buildParameterDiff(base, proposed);
    expect(diff.structural).toEqual([
      { kind: "lattice-changed", text: "primitive vector a1 (0, 2.825, 2.825) → (0, 2.9, 2.9) Å" },
      { kind: "lattice-changed", text: "site B1 moved (1.4125, 1.4125, 1.4125) → (1.5, 1.5, 1.5) Å" },
      // a·√3/4 = 2.446522 Å (a = 5.65 Å), shown to six significant digits.
      { kind: "lattice-changed", text: "A–B shell 1 distance 2.44652 → 2.5 Å" },
      { kind: "electron-count-changed", text: "electron count per cell 8 → 7" },
    ]);
    const nearby = edit(base, (d) => (d.shells[0].distance += 1e-9));
    expect(buildParameterDiff(base, nearby).structural[0].text).toBe(`A–B shell 1 distance ${base.shells[0].distance} → ${nearby.shells[0].distance} Å`);
    expect(diff.gauge.verdict).toBe("physical change");
  });

  it("matches explicit hoppings by orbitals and translation, not by list position", () => {
    const hop = (to: number, re: number, im?: number) => ({
      from: { site: "A1", orbital: "s" as const }, to: { site: "A1", orbital: "s" as const }, translation: [to], value: im === undefined ? { re } : { re, im },
    });
    const base = edit(sChainDocument(), (d) => (d.hoppings = [hop(2, -0.05), hop(3, -0.01, 0.002)]));
    const proposed = edit(base, (d) => (d.hoppings = [hop(4, 0.003), hop(3, -0.02, 0.002)]));
    const diff = buildParameterDiff(base, proposed);
    const rows = byKey(diff.rows);
    // [3] keeps index 1 and changes Re; [2] (index 0 in the base) is removed and [4] takes index 0; neither lists an Im row (Im is left out).
    expect(Object.keys(rows).sort()).toEqual(["hopping/0/re", "hopping/0/re@base", "hopping/1/re"]);
    expect(rows["hopping/1/re"]).toMatchObject({ base: -0.01, proposed: -0.02, group: "explicit hoppings", label: "Re t A1:s → A1:s [3]" });
    expect(rows["hopping/0/re"]).toMatchObject({ base: null, proposed: 0.003, label: "Re t A1:s → A1:s [4]" });
    expect(rows["hopping/0/re@base"]).toMatchObject({ base: -0.05, proposed: null, label: "Re t A1:s → A1:s [2]" });
    expect(diff.structural).toEqual([
      { kind: "hopping-removed", text: "hopping A1:s → A1:s [2] removed" },
      { kind: "hopping-added", text: "hopping A1:s → A1:s [4] added" },
    ]);
    const inserted = edit(base, (d) => d.hoppings?.unshift(hop(5, 0.001)));
    expect(buildParameterDiff(base, inserted).rows.map((r) => r.key)).toEqual(["hopping/0/re"]);
  });

  it("treats every parameter as added when there is no base release", () => {
    const doc = sChainDocument();
    const diff = buildParameterDiff(null, doc);
    expect(diff.rows.map((r) => [r.key, r.base, r.proposed]).sort()).toEqual([["onsite/A/s", null, 0.5], ["shell/A-A/1/ss_sigma", null, -1]]);
    expect(diff.gauge.verdict).toBe("physical change");
  });
});

describe("keyed parameter diff: ordering", () => {
  // s chain E(k) = ε + 2t·cos(2πk) (one s orbital, nearest neighbours; Ashcroft & Mermin, Solid State Physics (1976),
  // ch. 10): a change δε shifts every level by δε, a change δt shifts E by 2δt·cos(2πk), largest (2|δt|) at Γ and X,
  // which the default path Γ–X contains.
  it("sorts by |effect| first", () => {
    const base = sChainDocument(0.5, -1);
    const big = buildParameterDiff(base, sChainDocument(0.8, -1.2)).rows;
    expect(big.map((r) => r.key)).toEqual(["shell/A-A/1/ss_sigma", "onsite/A/s"]);
    expect(big[0].effect).toBeCloseTo(0.4, 12);
    expect(big[1].effect).toBeCloseTo(0.3, 12);
    const small = buildParameterDiff(base, sChainDocument(0.8, -1.1)).rows;
    expect(small.map((r) => r.key)).toEqual(["onsite/A/s", "shell/A-A/1/ss_sigma"]);
  });

  it("sorts by |%Δ| or key on request and groups rows under the group of their first row", () => {
    const row = (key: string, group: string, effect: number | null, percent: number | null) =>
      ({ key, group, label: key, base: 1, proposed: 2, delta: 1, percent, signFlip: false, effect, effectMethod: null }) as ParamDiffRow;
    const rows = [row("b", "G1", 0.1, -50), row("a", "G2", 0.3, 5), row("c", "G1", null, null), row("d", "G2", 0.2, 80)];
    expect(sortParamRows(rows, "effect").map((r) => r.key)).toEqual(["a", "d", "b", "c"]);
    expect(sortParamRows(rows, "percent").map((r) => r.key)).toEqual(["d", "b", "a", "c"]);
    expect(sortParamRows(rows, "key").map((r) => r.key)).toEqual(["a", "b", "c", "d"]);
    expect(groupParamRows(rows, "effect").map((g) => [g.group, g.rows.map((r) => r.key)])).toEqual([["G2", ["a", "d"]], ["G1", ["b", "c"]]]);
  });
});
