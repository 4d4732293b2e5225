import { describe, expect, it } from "vitest";
import { setParameters } from "@/lib/tb/parameters";
import { checkGaugeChange } from "@/lib/tb/analysis/gauge";
import { solveSignFlips } from "@/lib/tb/analysis/gauge-parity";
import { spChainDocument, zincBlendeDocument } from "./documents";

// A diagonal unitary of ±1 on the basis leaves every eigenvalue unchanged and multiplies each Slater–Koster integral
// by the product of the signs of its two orbitals (Slater & Koster, Phys. Rev. 94, 1498 (1954): integrals are
// defined between fixed orbital phases, so a phase change only relabels them).

describe("sign-flip solver", () => {
  it("solves a consistent parity system with the fewest flips and finds a contradiction", () => {
    const ok = solveSignFlips(["a", "b", "c"], [
      { a: "a", b: "b", flip: true, source: "ab" },
      { a: "b", b: "c", flip: false, source: "bc" },
    ]);
    expect(ok).toEqual({ consistent: true, flipped: ["a"] });
    const bad = solveSignFlips(["a", "b"], [
      { a: "a", b: "b", flip: true, source: "ab" },
      { a: "b", b: "b", flip: true, source: "bb" },
    ]);
    expect(bad).toMatchObject({ consistent: false });
  });
});

describe("gauge check", () => {
  it("recognises p → −p on the only species of a chain (every sp_sigma changes sign) as no physical change", () => {
    const before = spChainDocument();
    const after = spChainDocument({ sp: -1.1, sp2: -0.15 });
    const v = checkGaugeChange(before, after);
    expect(v.status).toBe("no physical change");
    expect(v.flips).toEqual([{ species: "A", kind: "p" }]);
    expect(v.maxBandShift).toBeLessThan(1e-10);
  });

  it("does not excuse a sign flip of sp_sigma in one shell only (the bands change)", () => {
    const v = checkGaugeChange(spChainDocument(), spChainDocument({ sp: -1.1 }));
    expect(v.status).toBe("physical change");
    expect(v.maxBandShift).toBeGreaterThan(1e-3);
  });

  it("recognises flipping every p orbital of species B in a zinc-blende model (sp_sigma, pp_sigma, pp_pi → −)", () => {
    const before = zincBlendeDocument();
    const after = zincBlendeDocument({ sp_sigma: -2.1, pp_sigma: -3.0, pp_pi: 0.8 });
    const v = checkGaugeChange(before, after);
    expect(v.status).toBe("no physical change");
    expect(v.flips).toEqual([{ species: "B", kind: "p" }]);
    expect(v.explanation).toMatch(/every p orbital on B/);
  });

  it("recognises sp_sigma and ps_sigma → − together as p → −p on both species", () => {
    const v = checkGaugeChange(zincBlendeDocument(), zincBlendeDocument({ sp_sigma: -2.1, ps_sigma: -2.4 }));
    expect(v.status).toBe("no physical change");
    expect(v.flips).toEqual([{ species: "A", kind: "p" }, { species: "B", kind: "p" }]);
  });

  it("does not excuse a genuine sign flip of pp_pi alone", () => {
    const v = checkGaugeChange(zincBlendeDocument(), zincBlendeDocument({ pp_pi: 0.8 }));
    expect(v.status).toBe("physical change");
    expect(v.maxBandShift).toBeGreaterThan(1e-3);
  });

  it("calls a change of magnitude or of an on-site sign physical, and no change identical", () => {
    const doc = zincBlendeDocument();
    expect(checkGaugeChange(doc, zincBlendeDocument({ pp_pi: -0.81 })).status).toBe("physical change");
    expect(checkGaugeChange(doc, setParameters(doc, { "onsite/A/s": 8.3 })).status).toBe("physical change");
    expect(checkGaugeChange(doc, doc).status).toBe("identical");
  });
});
