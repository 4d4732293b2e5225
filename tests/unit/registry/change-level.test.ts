import { describe, expect, it } from "vitest";
import { assessChange, suggestVersion, versionProblem } from "@/lib/registry/change-level";
import { sortVersionsDescending } from "@/lib/registry/semver";
import { setParameters } from "@/lib/tb/parameters";
import { chain } from "./helpers";

describe("change level of a proposal against its base", () => {
  it("is minor when only parameter values change", () => {
    const base = chain();
    const a = assessChange(base, setParameters(base, { "shell/A-A/1/sp_sigma": 1.9 }));
    expect(a.level).toBe("minor");
  });

  it("is patch when only metadata changes (name, description, provenance, validity)", () => {
    const base = chain();
    const next = { ...base, name: "renamed", description: "new words", validity: { ...base.validity, notes: "tightened" }, provenance: { ...base.provenance, notes: "more detail" } };
    expect(assessChange(base, next).level).toBe("patch");
  });

  it("is major when an orbital is added, and names it", () => {
    const base = chain();
    const next = { ...base, sites: [{ ...base.sites[0], orbitals: [...base.sites[0].orbitals, "px" as const] }], onsite: { A: { ...base.onsite.A, px: 1.5 } } };
    const a = assessChange(base, next);
    expect(a.level).toBe("major");
    expect(a.reasons.join(" ")).toContain("A1:px");
  });

  it("is major when a neighbour shell is added or removed", () => {
    const base = chain();
    const second = { ...base.shells[0], index: 2, distance: 5, params: { ss_sigma: -0.1 } };
    expect(assessChange(base, { ...base, shells: [...base.shells, second] }).level).toBe("major");
    expect(assessChange({ ...base, shells: [...base.shells, second] }, base).reasons.join(" ")).toContain("removed: A-A/2");
  });

  it("is major when a site is added, without listing its orbitals separately", () => {
    const base = chain();
    const site = { label: "A2", species: "A", position: [0, 0, 1.25] as [number, number, number], orbitals: ["s" as const] };
    const a = assessChange(base, { ...base, sites: [...base.sites, site] });
    expect(a.level).toBe("major");
    expect(a.reasons).toEqual(["Sites added: A2."]);
  });

  it("is major when spin–orbit coupling is switched on (the basis doubles)", () => {
    const base = chain();
    expect(assessChange(base, { ...base, spinOrbit: { A: 0.1 } }).level).toBe("major");
  });

  it("is major for the first release of a family", () => {
    expect(assessChange(null, chain()).level).toBe("major");
  });
});

describe("suggested version", () => {
  it("bumps the family's newest version by the change level (semver.org 2.0.0, items 6–8)", () => {
    const existing = ["1.0.0", "1.1.0"];
    expect(suggestVersion(existing, "minor")).toBe("1.2.0");
    expect(suggestVersion(existing, "major")).toBe("2.0.0");
    expect(suggestVersion(existing, "patch")).toBe("1.1.1");
    expect(suggestVersion([], "minor")).toBe("1.0.0");
  });

  it("compares versions numerically, not as text", () => {
    expect(sortVersionsDescending(["1.9.0", "1.10.0", "1.2.3"])).toEqual(["1.10.0", "1.9.0", "1.2.3"]);
    expect(suggestVersion(["1.9.0", "1.10.0"], "patch")).toBe("1.10.1");
  });

  it("may be raised, never lowered, and never reuse an existing version", () => {
    const existing = ["1.0.0", "1.1.0"];
    expect(versionProblem("1.2.0", "1.2.0", existing)).toBeNull();
    expect(versionProblem("2.0.0", "1.2.0", existing)).toBeNull();
    expect(versionProblem("1.1.1", "1.2.0", existing)).toMatch(/raised, not lowered/);
    expect(versionProblem("1.1.0", "1.0.0", existing)).toMatch(/not above the existing release 1\.1\.0/);
    expect(versionProblem("1.2", "1.2.0", existing)).toMatch(/MAJOR\.MINOR\.PATCH/);
    expect(versionProblem("01.2.0", "1.2.0", existing)).toMatch(/MAJOR\.MINOR\.PATCH/);
  });
});
