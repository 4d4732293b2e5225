import { shellKey } from "@/lib/tb/parameters";
import { getAt, isRecord, setAt, type Draft } from "./draft-path";
import { asArray, asRecord, hasFullPShell, readShells, siteSpecies, speciesKinds, speciesOrbitals } from "./draft-read";
import { looseParameterValues, requiredBondKeys } from "./parameter-keys";

function baseShellParams(base: unknown, species: [string, string], index: number | null): Record<string, unknown> {
  const match = readShells(asRecord(base)).find((s) => s.index === index && s.species[0] === species[0] && s.species[1] === species[1]);
  return match?.params ?? {};
}

function numberOr(value: unknown, fallback: number): number {
  return typeof value === "number" && Number.isFinite(value) ? value : fallback;
}

function syncOnsite(draft: Draft, base: unknown): Draft {
  const present = siteSpecies(draft);
  const onsite: Record<string, unknown> = {};
  for (const species of present) {
    const current = asRecord(asRecord(draft.onsite)[species]);
    const row: Record<string, unknown> = {};
    for (const orbital of speciesOrbitals(draft, species)) {
      row[orbital] = orbital in current ? current[orbital] : numberOr(getAt(base, ["onsite", species, orbital]), 0);
    }
    onsite[species] = row;
  }
  return { ...draft, onsite };
}

function syncShells(draft: Draft, base: unknown): Draft {
  const present = new Set(siteSpecies(draft));
  const shells = asArray(draft.shells).map((raw, i) => {
    const shell = readShells(draft)[i];
    const [a, b] = shell.species;
    if (!isRecord(raw) || !present.has(a) || !present.has(b)) return raw;
    const fallback = baseShellParams(base, shell.species, shell.index);
    const params: Record<string, unknown> = {};
    for (const key of requiredBondKeys(speciesKinds(draft, a), speciesKinds(draft, b), a === b, shell.params)) {
      params[key] = key in shell.params ? shell.params[key] : numberOr(fallback[key], 0);
    }
    return { ...raw, params };
  });
  return { ...draft, shells };
}

function syncSpinOrbit(draft: Draft): Draft {
  if (!isRecord(draft.spinOrbit)) return draft;
  const kept = Object.entries(draft.spinOrbit).filter(([species]) => speciesOrbitals(draft, species).some((o) => o.startsWith("p")));
  const next = setAt(draft, ["spinOrbit"], kept.length ? Object.fromEntries(kept) : undefined);
  return isRecord(next.conventions) ? setAt(next, ["conventions", "spinLayout"], kept.length ? "up-block-then-down-block" : "none") : next;
}

function pruneCitations(draft: Draft): Draft {
  const citations = getAt(draft, ["provenance", "citations"]);
  if (!isRecord(citations)) return draft;
  const keys = looseParameterValues(draft);
  return setAt(draft, ["provenance", "citations"], Object.fromEntries(Object.entries(citations).filter(([key]) => keys.has(key))));
}

/**
 * After a structural edit (orbitals, sites, species, shells): on-site energies exactly for the orbitals the sites carry,
 * each shell exactly the Slater–Koster keys its species need, spin–orbit only where p orbitals remain (with the spin
 * layout to match), citations only for parameters that exist. New entries start from the base's value, else 0.
 */
export function syncDerived(draft: Draft, base: unknown): Draft {
  return pruneCitations(syncSpinOrbit(syncShells(syncOnsite(draft, base), base)));
}

/** Moves citations of one shell to its new key when its species or index change, so the modeller's text survives. */
export function moveShellCitations(draft: Draft, from: { species: [string, string]; index: number | null }, to: { species: [string, string]; index: number | null }): Draft {
  const citations = getAt(draft, ["provenance", "citations"]);
  if (!isRecord(citations) || from.index === null || to.index === null) return draft;
  const oldPrefix = `shell/${shellKey(from.species, from.index)}/`;
  const newPrefix = `shell/${shellKey(to.species, to.index)}/`;
  if (oldPrefix === newPrefix) return draft;
  const moved = Object.entries(citations).map(([key, text]) => [key.startsWith(oldPrefix) ? newPrefix + key.slice(oldPrefix.length) : key, text]);
  return setAt(draft, ["provenance", "citations"], Object.fromEntries(moved));
}

export function speciesHasFullPShell(draft: Draft, species: string): boolean {
  return hasFullPShell(speciesOrbitals(draft, species));
}
