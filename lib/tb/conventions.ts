import { z } from "zod";

/** How the document's numbers are meant; stated in every document and checked on load. */
export const CONVENTION_SCHEMA = z.strictObject({
  units: z.strictObject({ energy: z.literal("eV"), length: z.literal("angstrom") }),
  energyZero: z.string().min(1).describe("what E = 0 means, e.g. 'valence-band maximum' or 'free-atom s level'"),
  blochPhase: z
    .enum(["atomic-position", "cell"])
    .describe("atomic-position: e^{ik·(R+τj−τi)}; cell: e^{ik·R}. Eigenvalues agree; eigenvector phases differ"),
  orbitalOrder: z.literal("site-then-listed-orbital").describe("basis: sites in document order, each site's orbitals in listed order"),
  spinLayout: z
    .enum(["none", "up-block-then-down-block"])
    .describe("with spin–orbit the basis doubles: every orbital spin up, then every orbital spin down"),
  spinOrbitTerm: z.literal("lambda-L-dot-S").describe("H = λ L·S on a p shell (ħ = 1): j = 3/2 at +λ/2, j = 1/2 at −λ"),
  slaterKosterKeys: z
    .literal("t1-on-from-atom")
    .describe("key <t1><t2>_<m>: t1 on the shell's first species, t2 on its second; ⟨s_a|H|px_b⟩ = l·sp_sigma, ⟨px_a|H|s_b⟩ = −l·ps_sigma"),
});

export type Conventions = z.infer<typeof CONVENTION_SCHEMA>;

export const DEFAULT_CONVENTIONS: Conventions = {
  units: { energy: "eV", length: "angstrom" },
  energyZero: "arbitrary",
  blochPhase: "atomic-position",
  orbitalOrder: "site-then-listed-orbital",
  spinLayout: "none",
  spinOrbitTerm: "lambda-L-dot-S",
  slaterKosterKeys: "t1-on-from-atom",
};

export interface ConventionIssue {
  path: string;
  message: string;
}

/** Cross-checks between the manifest and the rest of the document (the schema checks each field alone). */
export function checkConventions(conventions: Conventions, hasSpinOrbit: boolean): ConventionIssue[] {
  const issues: ConventionIssue[] = [];
  if (hasSpinOrbit && conventions.spinLayout === "none") {
    issues.push({
      path: "conventions.spinLayout",
      message: 'spinOrbit is set, so the basis doubles: spinLayout must be "up-block-then-down-block"',
    });
  }
  if (!hasSpinOrbit && conventions.spinLayout !== "none") {
    issues.push({ path: "conventions.spinLayout", message: 'no spinOrbit is set, so spinLayout must be "none"' });
  }
  return issues;
}
