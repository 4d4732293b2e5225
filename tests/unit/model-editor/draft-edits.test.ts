import { describe, expect, it } from "vitest";
import { validateModelDocument } from "@/lib/tb/document";
import chain from "@/db/seed/models/demo-sp-chain.json";
import diamond from "@/db/seed/models/demo-diamond-sp3s.json";
import { getAt, type Draft } from "@/app/_components/model-editor/draft-path";
import { addShell, addSite, removeShell, removeSite, setShellIndex, setSiteSpecies, setSpinOrbit, toggleOrbital } from "@/app/_components/model-editor/draft-edits";

const fresh = <T>(doc: T) => structuredClone(doc) as unknown as Draft;
const errorsOf = (draft: Draft) => validateModelDocument(draft).errors;

describe("orbital add/remove keeps on-site energies and shell parameters in step", () => {
  it("adding px to the s–pz chain adds its on-site energy and needs no new integral (p kind already present)", () => {
    const next = toggleOrbital(fresh(chain), null, 0, "px", true);
    expect(getAt(next, ["sites", 0, "orbitals"])).toEqual(["s", "px", "pz"]);
    expect(getAt(next, ["onsite", "A", "px"])).toBe(0);
    expect(Object.keys(getAt(next, ["shells", 0, "params"]) as object).sort()).toEqual(["pp_pi", "pp_sigma", "sp_sigma", "ss_sigma"]);
    expect(errorsOf(next)).toEqual([]);
  });
  it("removing pz drops its on-site energy, every p integral and their citations; the engine's validator accepts the result", () => {
    const next = toggleOrbital(fresh(chain), null, 0, "pz", false);
    expect(getAt(next, ["onsite", "A"])).toEqual({ s: -5 });
    expect(getAt(next, ["shells", 0, "params"])).toEqual({ ss_sigma: -1.4 });
    expect(Object.keys(getAt(next, ["provenance", "citations"]) as object).sort()).toEqual(["onsite/A/s", "shell/A-A/1/ss_sigma"]);
    expect(errorsOf(next)).toEqual([]);
  });
  it("adding a d orbital to an sp3s* model adds every s–d, p–d, d–d and s*–d integral the validator asks for", () => {
    const next = toggleOrbital(toggleOrbital(fresh(diamond), null, 0, "dxy", true), null, 1, "dxy", true);
    const params = getAt(next, ["shells", 0, "params"]) as Record<string, number>;
    for (const key of ["sd_sigma", "pd_sigma", "pd_pi", "dd_sigma", "dd_pi", "dd_delta"]) expect(params[key]).toBe(0);
    expect(errorsOf(next)).toEqual([]);
  });
  it("re-adding an orbital takes its values back from the base document", () => {
    const base = fresh(chain);
    const next = toggleOrbital(toggleOrbital(fresh(chain), base, 0, "pz", false), base, 0, "pz", true);
    expect(getAt(next, ["onsite", "A", "pz"])).toBe(1.5);
    expect(getAt(next, ["shells", 0, "params", "sp_sigma"])).toBe(1.8);
    expect(getAt(next, ["shells", 0, "params", "pp_sigma"])).toBe(2.6);
  });
});

describe("sites, species, shells and spin–orbit", () => {
  it("renaming the only species carries it through on-site energies, shells and citation keys", () => {
    const next = setSiteSpecies(fresh(chain), null, 0, "B");
    expect(getAt(next, ["onsite", "B", "s"])).toBe(-5);
    expect(getAt(next, ["shells", 0, "species"])).toEqual(["B", "B"]);
    expect(getAt(next, ["provenance", "citations", "shell/B-B/1/sp_sigma"])).toBe("invented demo value");
    expect(errorsOf(next)).toEqual([]);
  });
  it("a shell's citations follow a change of its index", () => {
    const next = setShellIndex(fresh(chain), 0, 2);
    expect(getAt(next, ["provenance", "citations", "shell/A-A/2/ss_sigma"])).toBe("invented demo value");
    expect(getAt(next, ["provenance", "citations", "shell/A-A/1/ss_sigma"])).toBeUndefined();
  });
  it("removing the only shell prunes its citations, which the validator would otherwise reject as unknown keys", () => {
    const next = removeShell(fresh(chain), null, 0);
    expect(Object.keys(getAt(next, ["provenance", "citations"]) as object).sort()).toEqual(["onsite/A/pz", "onsite/A/s"]);
    expect(errorsOf(next)).toEqual([]);
  });
  it("a new shell gets the next index and every integral its species need", () => {
    const next = addShell(fresh(chain), null);
    expect(getAt(next, ["shells", 1, "index"])).toBe(2);
    expect(Object.keys(getAt(next, ["shells", 1, "params"]) as object).sort()).toEqual(["pp_pi", "pp_sigma", "sp_sigma", "ss_sigma"]);
  });
  it("a new site copies the orbitals of its species; removing it restores the original", () => {
    const added = addSite(fresh(diamond), null);
    expect(getAt(added, ["sites", 2, "orbitals"])).toEqual(["s", "px", "py", "pz", "s*"]);
    expect(getAt(added, ["sites", 2, "label"])).toBe("X3");
    expect(removeSite(added, null, 2)).toEqual(fresh(diamond));
  });
  it("spin–orbit on a species switches the spin layout with it, as the conventions check demands", () => {
    const withP = toggleOrbital(toggleOrbital(fresh(chain), null, 0, "px", true), null, 0, "py", true);
    const on = setSpinOrbit(withP, null, "A", true);
    expect(getAt(on, ["spinOrbit", "A"])).toBe(0);
    expect(getAt(on, ["conventions", "spinLayout"])).toBe("up-block-then-down-block");
    expect(errorsOf(on)).toEqual([]);
    const off = setSpinOrbit(on, null, "A", false);
    expect(getAt(off, ["spinOrbit"])).toBeUndefined();
    expect(getAt(off, ["conventions", "spinLayout"])).toBe("none");
  });
});

describe("a new shell starts on a real neighbour distance", () => {
  it("the chain's second shell sits at twice the spacing", () => {
    const next = addShell(fresh(chain), null);
    expect(getAt(next, ["shells", 1, "distance"])).toBeCloseTo(5.0, 4);
  });
  it("diamond's second shell sits at a/√2 (the fcc nearest-neighbour distance of one sublattice)", () => {
    // Diamond: nearest neighbours at a√3/4, next nearest at a/√2 (Kittel, Introduction to Solid State Physics, 8th ed.,
    // 2005, ch. 1, diamond structure; standard geometry). a = 5.5 Å in the seed document.
    const next = addShell(fresh(diamond), null);
    expect(getAt(next, ["shells", 1, "distance"])).toBeCloseTo(5.5 / Math.SQRT2, 3);
    expect(errorsOf(next)).toEqual([]);
  });
});
