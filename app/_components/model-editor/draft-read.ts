import { ORBITALS, orbitalKind, type Orbital, type OrbitalKind } from "@/lib/tb/orbitals";
import { isRecord, type Draft } from "./draft-path";

/** Defensive readers: the draft may be any JSON, so every read tolerates a missing or mistyped part. */
export interface LooseSite {
  label: string;
  species: string;
  orbitals: Orbital[];
}

export interface LooseShell {
  species: [string, string];
  index: number | null;
  params: Record<string, unknown>;
}

export function asRecord(value: unknown): Record<string, unknown> {
  return isRecord(value) ? value : {};
}

export function asArray(value: unknown): unknown[] {
  return Array.isArray(value) ? value : [];
}

export function asText(value: unknown): string {
  return typeof value === "string" ? value : "";
}

export function isOrbital(value: unknown): value is Orbital {
  return typeof value === "string" && (ORBITALS as readonly string[]).includes(value);
}

export function readSites(draft: Draft): LooseSite[] {
  return asArray(draft.sites).map((raw) => {
    const site = asRecord(raw);
    return { label: asText(site.label), species: asText(site.species), orbitals: asArray(site.orbitals).filter(isOrbital) };
  });
}

export function readShells(draft: Draft): LooseShell[] {
  return asArray(draft.shells).map((raw) => {
    const shell = asRecord(raw);
    const pair = asArray(shell.species);
    return {
      species: [asText(pair[0]), asText(pair[1])],
      index: typeof shell.index === "number" ? shell.index : null,
      params: asRecord(shell.params),
    };
  });
}

/** Species in order of first appearance on a site. */
export function siteSpecies(draft: Draft): string[] {
  return [...new Set(readSites(draft).map((s) => s.species).filter(Boolean))];
}

/** Orbitals that some site of `species` carries, in canonical order. */
export function speciesOrbitals(draft: Draft, species: string): Orbital[] {
  const present = new Set(readSites(draft).filter((s) => s.species === species).flatMap((s) => s.orbitals));
  return ORBITALS.filter((o) => present.has(o));
}

export function speciesKinds(draft: Draft, species: string): Set<OrbitalKind> {
  return new Set(speciesOrbitals(draft, species).map(orbitalKind));
}

export function hasFullPShell(orbitals: readonly Orbital[]): boolean {
  return orbitals.includes("px") && orbitals.includes("py") && orbitals.includes("pz");
}
