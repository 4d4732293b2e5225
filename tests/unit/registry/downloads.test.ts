import { describe, expect, it } from "vitest";
import { bandsAtPoints, bandsCsv, bandsOnDefaultPath, hoppingsCsv, parseKPointList, releaseHoppings } from "@/lib/registry/downloads";
import { chain } from "./helpers";

describe("bands for downstream codes", () => {
  it("at the zone boundary of the s + pz chain equal the two unmixed levels", () => {
    // Chain along z with lattice constant a: H_ss = εs + 2 V_ssσ cos(ka), H_zz = εp + 2 V_ppσ cos(ka) and
    // H_sz = 2i V_spσ sin(ka) (Slater & Koster, Phys. Rev. 94, 1498 (1954), Table I with direction cosine n = ±1).
    // At ka = π the mixing vanishes, so the levels are εs − 2 V_ssσ and εp − 2 V_ppσ.
    const doc = chain();
    const shell = doc.shells[0].params;
    const { energies } = bandsAtPoints(doc, [[0.5]]);
    const expected = [doc.onsite.A.s - 2 * shell.ss_sigma, doc.onsite.A.pz - 2 * shell.pp_sigma].sort((a, b) => a - b);
    expect(energies[0][0]).toBeCloseTo(expected[0], 12);
    expect(energies[0][1]).toBeCloseTo(expected[1], 12);
  });

  it("on the default path come with distance, ticks and one row per k-point; the CSV has a header and the same rows", () => {
    const bands = bandsOnDefaultPath(chain(), 11);
    expect(bands.kFrac.length).toBe(bands.energies.length);
    expect(bands.distance?.length).toBe(bands.kFrac.length);
    const lines = bandsCsv(bands).trim().split("\n");
    expect(lines[0]).toBe("distance_inv_angstrom,k1,band_1_ev,band_2_ev");
    expect(lines.length).toBe(bands.kFrac.length + 1);
    expect(lines[1].split(",").map(Number)).toEqual([bands.distance![0], ...bands.kFrac[0], ...bands.energies[0]]);
  });

  it("parse k-points as 'k1,k2,k3;…' with as many numbers as the lattice dimension", () => {
    expect(parseKPointList("0;0.25; 0.5", 1)).toEqual([[0], [0.25], [0.5]]);
    expect(parseKPointList("0,0", 1)).toMatch(/k-point 1 must hold 1 finite/);
    expect(parseKPointList("0,x,0", 3)).toMatch(/finite numbers/);
    expect(parseKPointList("", 1)).toMatch(/at least one/);
    expect(parseKPointList("0;0;0", 1, 2)).toMatch(/At most 2/);
    for (const huge of ["1e308", "-1e308", "1e20", "0;1000.5", "Infinity"]) expect(parseKPointList(huge, 1)).toMatch(/between −1000 and 1000/);
    expect(parseKPointList("1000,-1000", 2)).toEqual([[1000, -1000]]);
  });
});

describe("real-space hopping list", () => {
  it("holds the on-site energies and both directions of every nearest-neighbour bond, in CSV too", () => {
    const doc = chain();
    const list = releaseHoppings(doc);
    const onsite = list.filter((h) => h.distance === 0);
    expect(onsite.map((h) => h.re).sort((a, b) => a - b)).toEqual([doc.onsite.A.s, doc.onsite.A.pz].sort((a, b) => a - b));
    // s–s along ±z: ⟨s,0|H|s,±1⟩ = V_ssσ (Slater & Koster 1954, Table I: E_s,s = V_ssσ).
    const ss = list.filter((h) => h.from === h.to && h.from.endsWith(":s") && h.distance > 0);
    expect(ss.map((h) => h.translation[0]).sort()).toEqual([-1, 1]);
    for (const h of ss) expect(h.re).toBeCloseTo(doc.shells[0].params.ss_sigma, 12);
    const csv = hoppingsCsv(list).trim().split("\n");
    expect(csv[0]).toBe("from,to,n1,n2,n3,x_angstrom,y_angstrom,z_angstrom,distance_angstrom,re_ev,im_ev");
    expect(csv.length).toBe(list.length + 1);
  });
});
