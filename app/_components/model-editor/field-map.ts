import { ORBITALS, type Orbital } from "@/lib/tb/orbitals";
import { isWithin, pathText, type Draft } from "./draft-path";
import { asArray, asRecord, readShells, readSites, siteSpecies, speciesKinds, speciesOrbitals } from "./draft-read";
import { requiredBondKeys } from "./parameter-keys";

/** Where the editor renders what: shared by the sections (to draw inputs) and the issue map (to find them). */
export const RANGE_FIELDS = [
  ["provenance", "fitWindow"],
  ["validity", "strain"],
  ["validity", "temperature"],
  ["validity", "energyWindow"],
] as const;

export const TEXT_FIELDS = [
  ["name"],
  ["description"],
  ["conventions", "energyZero"],
  ["conventions", "blochPhase"],
  ["conventions", "spinLayout"],
  ["provenance", "referenceMethod"],
  ["provenance", "referenceCode"],
  ["provenance", "functional"],
  ["provenance", "structureSource"],
  ["provenance", "kMesh"],
  ["provenance", "fitWeights"],
  ["provenance", "notes"],
  ["validity", "notes"],
] as const;

/** Onsite grid: species rows (site order, then leftovers from the document), orbital columns in canonical order. */
export function onsiteLayout(draft: Draft): { species: string[]; orbitals: Orbital[]; has: (species: string, orbital: string) => boolean } {
  const onsite = asRecord(draft.onsite);
  const species = [...new Set([...siteSpecies(draft), ...Object.keys(onsite)])];
  const has = (s: string, o: string) => speciesOrbitals(draft, s).includes(o as Orbital) || o in asRecord(onsite[s]);
  const orbitals = ORBITALS.filter((o) => species.some((s) => has(s, o)));
  return { species, orbitals, has };
}

/** The Slater–Koster inputs of one shell: the keys its species need, then any other key the document holds. */
export function shellParamKeys(draft: Draft, shellIndex: number): string[] {
  const shell = readShells(draft)[shellIndex];
  if (!shell) return [];
  const [a, b] = shell.species;
  const needed = requiredBondKeys(speciesKinds(draft, a), speciesKinds(draft, b), a === b, shell.params);
  return [...needed, ...Object.keys(shell.params).filter((k) => !needed.includes(k))];
}

/** Species that can carry a spin–orbit λ: those with p orbitals, plus any the document already lists. */
export function spinOrbitSpecies(draft: Draft): string[] {
  const withP = siteSpecies(draft).filter((s) => speciesOrbitals(draft, s).some((o) => o.startsWith("p")));
  return [...new Set([...withP, ...Object.keys(asRecord(draft.spinOrbit))])];
}

/** Every field path the editor draws an input for, given the citation keys it shows. */
export function editorFields(draft: Draft, citationKeys: readonly string[]): string[] {
  const out: string[] = [];
  const add = (...path: (string | number)[]) => out.push(pathText(path));
  TEXT_FIELDS.forEach((p) => add(...p));
  asArray(asRecord(draft.lattice).vectors).forEach((_, i) => [0, 1, 2].forEach((j) => add("lattice", "vectors", i, j)));
  add("kPath", "lattice");
  add("kPath", "pointsTotal");
  readSites(draft).forEach((_, i) => {
    add("sites", i, "label");
    add("sites", i, "species");
    [0, 1, 2].forEach((j) => add("sites", i, "position", j));
    add("sites", i, "orbitals");
  });
  const grid = onsiteLayout(draft);
  grid.species.forEach((s) => grid.orbitals.forEach((o) => grid.has(s, o) && add("onsite", s, o)));
  readShells(draft).forEach((_, i) => {
    add("shells", i, "species", 0);
    add("shells", i, "species", 1);
    ["index", "distance", "tolerance"].forEach((f) => add("shells", i, f));
    shellParamKeys(draft, i).forEach((k) => add("shells", i, "params", k));
  });
  spinOrbitSpecies(draft).forEach((s) => add("spinOrbit", s));
  add("electronCount");
  asArray(draft.hoppings).forEach((_, i) => ["re", "im"].forEach((part) => add("hoppings", i, "value", part)));
  RANGE_FIELDS.forEach((p) => [0, 1].forEach((j) => add(...p, j)));
  citationKeys.forEach((k) => add("provenance", "citations", k));
  return out;
}

/**
 * The field an issue belongs to: the field at its path, else the nearest enclosing field ("sites[0].position[1]"
 * inside a whole-vector input), else the first field inside it ("validity.strain" → its lower bound), else the same
 * search one level up. null when nothing on screen is near (e.g. an unknown top-level key).
 */
export function fieldForIssue(issuePath: string, fields: readonly string[]): string | null {
  if (fields.includes(issuePath)) return issuePath;
  const enclosing = fields.filter((f) => f !== "" && isWithin(issuePath, f)).sort((a, b) => b.length - a.length)[0];
  if (enclosing) return enclosing;
  for (let at = issuePath; at !== ""; at = parentPath(at)) {
    const inside = fields.find((f) => isWithin(f, at));
    if (inside) return inside;
  }
  return null;
}

export function parentPath(path: string): string {
  const cut = Math.max(path.lastIndexOf("."), path.lastIndexOf("["));
  return cut <= 0 ? "" : path.slice(0, cut);
}

const SECTIONS: Record<string, string> = {
  lattice: "cell", kPath: "cell", sites: "sites", onsite: "onsite", shells: "bonds", spinOrbit: "filling", electronCount: "filling",
  hoppings: "hoppings", conventions: "provenance", provenance: "provenance", validity: "provenance",
};

/** The editor section an issue path falls in (the document header for anything else). */
export function sectionForIssue(issuePath: string): string {
  if (issuePath.startsWith("provenance.citations")) return "citations";
  return SECTIONS[issuePath.split(/[.[]/)[0]] ?? "document";
}
