import { physicsHash } from "@/lib/tb/canonical";
import type { ModelDocument } from "@/lib/tb/document";
import { bumpSemver, compareSemver, formatSemver, parseSemver, sortVersionsDescending, type ChangeLevel } from "./semver";

export interface ChangeAssessment {
  level: ChangeLevel;
  /** Why this level, in words for the changelog and the release form. */
  reasons: string[];
}

function keysOf(doc: ModelDocument) {
  return {
    sites: new Set(doc.sites.map((s) => s.label)),
    orbitals: new Set(doc.sites.flatMap((s) => s.orbitals.map((o) => `${s.label}:${o}`))),
    shells: new Set(doc.shells.map((s) => `${s.species[0]}-${s.species[1]}/${s.index}`)),
  };
}

function setDifference(a: Set<string>, b: Set<string>): string[] {
  return [...a].filter((x) => !b.has(x)).sort();
}

/**
 * How big a change is for the codes that read it: major when the basis or the bond list changes shape (sites,
 * orbitals or neighbour shells added or removed, or spin–orbit switched on or off, which doubles the basis); minor when
 * only values that enter H(k) change; patch when only metadata (names, provenance, validity, path) changes.
 */
export function assessChange(base: ModelDocument | null, proposed: ModelDocument): ChangeAssessment {
  if (!base) return { level: "major", reasons: ["First release of this family."] };
  const before = keysOf(base), after = keysOf(proposed);
  const reasons: string[] = [];
  const describe = (what: string, added: string[], removed: string[]) => {
    if (added.length) reasons.push(`${what} added: ${added.join(", ")}.`);
    if (removed.length) reasons.push(`${what} removed: ${removed.join(", ")}.`);
  };
  describe("Sites", setDifference(after.sites, before.sites), setDifference(before.sites, after.sites));
  const newSites = new Set(setDifference(after.sites, before.sites)), goneSites = new Set(setDifference(before.sites, after.sites));
  const siteOf = (key: string) => key.split(":")[0];
  describe(
    "Orbitals",
    setDifference(after.orbitals, before.orbitals).filter((k) => !newSites.has(siteOf(k))),
    setDifference(before.orbitals, after.orbitals).filter((k) => !goneSites.has(siteOf(k))),
  );
  describe("Neighbour shells", setDifference(after.shells, before.shells), setDifference(before.shells, after.shells));
  const hasSoc = (d: ModelDocument) => Object.keys(d.spinOrbit ?? {}).length > 0;
  if (hasSoc(base) !== hasSoc(proposed)) reasons.push(`Spin–orbit coupling switched ${hasSoc(proposed) ? "on" : "off"} (the basis size changes).`);
  if (reasons.length) return { level: "major", reasons };
  if (physicsHash(base) !== physicsHash(proposed)) return { level: "minor", reasons: ["Parameter values change; the basis and the bond list keep their shape."] };
  return { level: "patch", reasons: ["Metadata only (description, provenance, validity or path); the bands do not change."] };
}

/** The next version after the family's newest release, by the size of the change; 1.0.0 for a first release. */
export function suggestVersion(existing: readonly string[], level: ChangeLevel): string {
  const newest = sortVersionsDescending(existing).map(parseSemver).find((v) => v !== null);
  return newest ? formatSemver(bumpSemver(newest, level)) : "1.0.0";
}

/** The curator may raise the suggested version, never lower it, and never reuse or go below an existing one. */
export function versionProblem(chosen: string, suggested: string, existing: readonly string[]): string | null {
  const v = parseSemver(chosen);
  if (!v) return "Use a version of the form MAJOR.MINOR.PATCH, e.g. 1.2.0.";
  const floor = parseSemver(suggested);
  if (floor && compareSemver(v, floor) < 0) return `The change needs at least ${suggested}; a version may be raised, not lowered.`;
  for (const e of existing) {
    const other = parseSemver(e);
    if (other && compareSemver(v, other) <= 0) return `Version ${chosen} is not above the existing release ${e}.`;
  }
  return null;
}
