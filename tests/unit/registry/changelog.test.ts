import { describe, expect, it } from "vitest";
import { draftChangelog } from "@/lib/registry/changelog";

describe("changelog draft", () => {
  const assessment = { level: "minor" as const, reasons: ["Parameter values change; the basis and the bond list keep their shape."] };

  it("lists each changed parameter by key with old, new and signed difference, then the rationale", () => {
    const text = draftChangelog({
      title: "Stiffer s–p bond",
      baseVersion: "1.0.0",
      assessment,
      changes: [
        { key: "shell/A-A/1/sp_sigma", label: "sp_sigma (A–A, shell 1)", base: 1.8, proposed: 1.9 },
        { key: "onsite/A/pz", label: "ε(A, pz)", base: 1.5, proposed: 1.25 },
      ],
      rationale: "Matches the reference gap at X.",
    });
    expect(text).toContain("Stiffer s–p bond (minor change from 1.0.0).");
    expect(text).toContain("`shell/A-A/1/sp_sigma`): 1.8 → 1.9 eV (Δ +0.1 eV)");
    expect(text).toContain("`onsite/A/pz`): 1.5 → 1.25 eV (Δ -0.25 eV)");
    expect(text.trim().endsWith("Matches the reference gap at X.")).toBe(true);
  });

  it("says when a parameter is added or removed and leaves out an empty rationale", () => {
    const text = draftChangelog({
      title: "t",
      baseVersion: null,
      assessment,
      changes: [
        { key: "soc/A", label: "λ(A)", base: null, proposed: 0.1 },
        { key: "shell/A-A/2/ss_sigma", label: "ss_sigma (A–A, shell 2)", base: -0.2, proposed: null },
      ],
      rationale: "  ",
    });
    expect(text).toContain("`soc/A`): added, 0.1 eV");
    expect(text).toContain("removed (was -0.2 eV)");
    expect(text).not.toContain("Rationale");
  });
});
