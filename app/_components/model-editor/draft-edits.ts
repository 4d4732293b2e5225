import { ORBITALS, type Orbital } from "@/lib/tb/orbitals";
import { getAt, isRecord, setAt, type Draft } from "./draft-path";
import { asArray, asRecord, readShells, readSites, siteSpecies } from "./draft-read";
import { moveShellCitations, syncDerived } from "./draft-sync";
import { neighbourShellDistance } from "./shell-distance";

/** Structural edits of a draft; each keeps on-site energies, shell parameters, spin–orbit and citations in step. */

function insertCanonical(orbitals: readonly Orbital[], orbital: Orbital): Orbital[] {
  const rank = ORBITALS.indexOf(orbital);
  const at = orbitals.findIndex((o) => ORBITALS.indexOf(o) > rank);
  return at < 0 ? [...orbitals, orbital] : [...orbitals.slice(0, at), orbital, ...orbitals.slice(at)];
}

export function toggleOrbital(draft: Draft, base: unknown, siteIndex: number, orbital: Orbital, on: boolean): Draft {
  const site = readSites(draft)[siteIndex];
  if (!site || site.orbitals.includes(orbital) === on) return draft;
  const orbitals = on ? insertCanonical(site.orbitals, orbital) : site.orbitals.filter((o) => o !== orbital);
  return syncDerived(setAt(draft, ["sites", siteIndex, "orbitals"], orbitals), base);
}

function unusedLabel(draft: Draft, species: string): string {
  const taken = new Set(readSites(draft).map((s) => s.label));
  let n = 1;
  while (taken.has(`${species}${n}`)) n++;
  return `${species}${n}`;
}

export function addSite(draft: Draft, base: unknown): Draft {
  const species = siteSpecies(draft)[0] ?? "A";
  const sibling = readSites(draft).find((s) => s.species === species);
  const site = { label: unusedLabel(draft, species), species, position: [0, 0, 0], orbitals: sibling?.orbitals ?? ["s"] };
  return syncDerived(setAt(draft, ["sites"], [...asArray(draft.sites), site]), base);
}

export function removeSite(draft: Draft, base: unknown, siteIndex: number): Draft {
  return syncDerived(setAt(draft, ["sites"], asArray(draft.sites).filter((_, i) => i !== siteIndex)), base);
}

function renameSpeciesEverywhere(draft: Draft, from: string, to: string): Draft {
  const rekey = (record: unknown) => (isRecord(record) ? Object.fromEntries(Object.entries(record).map(([k, v]) => [k === from ? to : k, v])) : record);
  let next = setAt(draft, ["onsite"], rekey(draft.onsite));
  if (draft.spinOrbit !== undefined) next = setAt(next, ["spinOrbit"], rekey(draft.spinOrbit));
  readShells(draft).forEach((shell, i) => {
    const pair = shell.species.map((s) => (s === from ? to : s)) as [string, string];
    next = moveShellCitations(setAt(next, ["shells", i, "species"], pair), shell, { species: pair, index: shell.index });
  });
  const citations = getAt(next, ["provenance", "citations"]);
  if (isRecord(citations)) {
    const renameKey = (key: string) => {
      const [kind, species, ...rest] = key.split("/");
      return (kind === "onsite" || kind === "soc") && species === from ? [kind, to, ...rest].join("/") : key;
    };
    const renamed = Object.entries(citations).map(([k, v]) => [renameKey(k), v]);
    next = setAt(next, ["provenance", "citations"], Object.fromEntries(renamed));
  }
  return next;
}

/**
 * A new species for one site. When no other site keeps the old name it is a rename, carried through on-site
 * energies, shells, spin–orbit and citations; otherwise the site splits off and its new species starts from the old
 * species' on-site energies.
 */
export function setSiteSpecies(draft: Draft, base: unknown, siteIndex: number, species: string): Draft {
  const sites = readSites(draft);
  const old = sites[siteIndex]?.species;
  if (old === undefined || old === species) return draft;
  const shared = sites.some((s, i) => i !== siteIndex && s.species === old);
  const taken = sites.some((s) => s.species === species);
  let next = setAt(draft, ["sites", siteIndex, "species"], species);
  if (!shared && !taken) next = renameSpeciesEverywhere(next, old, species);
  else if (!taken && isRecord(getAt(draft, ["onsite", old]))) next = setAt(next, ["onsite", species], getAt(draft, ["onsite", old]));
  return syncDerived(next, base);
}

export function addShell(draft: Draft, base: unknown): Draft {
  const species = siteSpecies(draft)[0] ?? "A";
  const shells = readShells(draft);
  const index = 1 + Math.max(0, ...shells.filter((s) => s.species[0] === species && s.species[1] === species).map((s) => s.index ?? 0));
  const baseShell = asArray(asRecord(base).shells).map(asRecord).find((s) => s.index === index && getAt(s, ["species", 0]) === species && getAt(s, ["species", 1]) === species);
  const distance = typeof baseShell?.distance === "number" ? baseShell.distance : (neighbourShellDistance(draft, [species, species], index) ?? 1);
  const shell = { species: [species, species], index, distance, tolerance: 0.001, params: {} };
  return syncDerived(setAt(draft, ["shells"], [...asArray(draft.shells), shell]), base);
}

export function removeShell(draft: Draft, base: unknown, shellIndex: number): Draft {
  return syncDerived(setAt(draft, ["shells"], asArray(draft.shells).filter((_, i) => i !== shellIndex)), base);
}

export function setShellSpecies(draft: Draft, base: unknown, shellIndex: number, end: 0 | 1, species: string): Draft {
  const shell = readShells(draft)[shellIndex];
  if (!shell) return draft;
  const pair = [...shell.species] as [string, string];
  pair[end] = species;
  const next = moveShellCitations(setAt(draft, ["shells", shellIndex, "species"], pair), shell, { species: pair, index: shell.index });
  return syncDerived(next, base);
}

/** Index edits are plain number edits, except that the shell's citations follow its key. */
export function setShellIndex(draft: Draft, shellIndex: number, value: unknown): Draft {
  const shell = readShells(draft)[shellIndex];
  if (!shell) return draft;
  const index = typeof value === "number" && Number.isInteger(value) ? value : null;
  return moveShellCitations(setAt(draft, ["shells", shellIndex, "index"], value), shell, { species: shell.species, index });
}

export function setSpinOrbit(draft: Draft, base: unknown, species: string, on: boolean): Draft {
  const baseValue = getAt(base, ["spinOrbit", species]);
  const value = on ? (typeof baseValue === "number" ? baseValue : 0) : undefined;
  return syncDerived(setAt(draft, ["spinOrbit", species], value), base);
}
