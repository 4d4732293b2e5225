import { describe, expect, it } from "vitest";
import type { BandViewData } from "@/lib/review/band-view";
import { buildBandCsv } from "@/lib/review/export-csv";
import { bandExportName, proposalSlug } from "@/lib/review/export-names";
import { standaloneSvg } from "@/lib/review/export-svg";
import { remarkRangeHref, rangeEndLabel } from "@/lib/review/band-range";

// Sources under test: lib/review/export-csv.ts, export-names.ts, export-svg.ts and band-range.ts.
const view: BandViewData = {
  path: { distance: [0, 0.5, 1], ticks: [{ index: 0, label: "Γ" }, { index: 2, label: "X" }], kFrac: [[0, 0], [0.25, 0], [0.5, 0]] },
  proposed: [[-1, 2], [-0.5, 2.5], [0, 3]],
  base: [[-1.25, 2], [-0.5, 2], [0.5, 3.5]],
  references: [
    {
      id: "r1", name: "GW, \"fine\"", fermiLevel: null,
      distance: [0.5, 0.75], kFrac: [[0.25, 0], [0.375, 0]], energies: [[-0.6, null], [-0.2, 2.7]], proposedAt: [[-0.5, 2.5], [-0.25, 2.75]],
    },
  ],
  baseFermi: null, proposedFermi: null, baseVbm: 0.5, proposedVbm: 0,
  dos: { energy: [], base: null, proposed: [] },
  electronCount: 2, spinDegeneracy: 2,
};

describe("CSV export of the band view", () => {
  const lines = buildBandCsv(view, { digits: 3 }).trimEnd().split("\n");

  it("has distance, k1…kd, base, proposed, ΔE and reference columns, quoting a name with a comma and quotes", () => {
    expect(lines[0]).toBe(
      'distance (1/Å),k1,k2,base_1 (eV),base_2 (eV),proposed_1 (eV),proposed_2 (eV),dE_1 (eV),dE_2 (eV),"GW, ""fine""_1 (eV)","GW, ""fine""_2 (eV)"',
    );
  });

  it("writes ΔE = proposed − base, puts a reference value on the path point it sits on and gives an off-path point its own row", () => {
    expect(lines.slice(1)).toEqual([
      "0.000000,0.000000,0.000000,-1.250,2.000,-1.000,2.000,0.250,0.000,,",
      "0.500000,0.250000,0.000000,-0.500,2.000,-0.500,2.500,0.000,0.500,-0.600,",
      "0.750000,0.375000,0.000000,,,,,,,-0.200,2.700",
      "1.000000,0.500000,0.000000,0.500,3.500,0.000,3.000,-0.500,-0.500,,",
    ]);
  });

  it("keeps only the rows inside the current k-range", () => {
    const ranged = buildBandCsv(view, { digits: 3, range: [0.4, 0.8] }).trimEnd().split("\n");
    expect(ranged.map((l) => l.split(",")[0])).toEqual(["distance (1/Å)", "0.500000", "0.750000"]);
  });
});

describe("export names, standalone SVG and k-range remark links", () => {
  it("names files <proposal-slug>-bands.<ext>", () => {
    expect(proposalSlug("Refit Ga–As sp_sigma (r2)")).toBe("refit-ga-as-sp-sigma-r2");
    expect(bandExportName("refit-ga-as", "png")).toBe("refit-ga-as-bands.png");
    expect(proposalSlug("ΓΓΓ")).toBe("proposal");
  });

  it("resolves the page's colour variables and declares the SVG namespace", () => {
    const out = standaloneSvg('<svg viewBox="0 0 10 10" class="w-full"><path stroke="var(--color-teal-line)" fill="var(--x, #123)"/></svg>', {
      palette: { "--color-teal-line": "#0f7c7a" },
      background: "#fffcf6",
      width: 10,
      height: 10,
    });
    expect(out).toContain('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" viewBox="0 0 10 10">');
    expect(out).toContain('stroke="#0f7c7a"');
    expect(out).toContain('fill="#123"');
    expect(out).not.toContain("var(");
    expect(out).not.toContain("class=");
  });

  it("labels range ends by tick when they sit on one, else by distance with 3 decimals", () => {
    expect(rangeEndLabel(view.path, 1)).toBe("X");
    expect(rangeEndLabel(view.path, 0.4567)).toBe("0.457");
    expect(remarkRangeHref("/proposals/p1/review", view.path, [1, 0])).toBe(`/proposals/p1/review?remark=k:${encodeURIComponent("Γ")}-X#remarks`);
    expect(remarkRangeHref("/r", view.path, [0.25, 1])).toBe("/r?remark=k:0.250-X#remarks");
  });
});
