import type { DocumentIssue } from "./document";
import type { ModelDocument } from "./document-schema";
import { checkConventions } from "./conventions";
import { STANDARD_PATHS, matchStandardLattice } from "./kpath-standard";
import { cellMeasure, reciprocalVectors, type Vec3 } from "./lattice";
import { bondSearchSize, distinctBondLengths, findBonds } from "./neighbours";
import { ORBITALS, bondKey, bondSymmetries, mirrorBondKey, orbitalKind, parseBondKey, type Orbital, type OrbitalKind } from "./orbitals";
import { listParameters } from "./parameters";

export const DEFAULT_SHELL_TOLERANCE = 1e-3;

/**
 * Site pairs the neighbour searches of one document may look at, all shells together (about half a second of one
 * core): a realistic document needs a few thousand (the demo models) to a few hundred thousand (a 16-site supercell),
 * while a shell distance far beyond the cell would make the search, and every later compile, run for hours.
 */
export const BOND_SEARCH_BUDGET = 2_000_000;

type Issues = { errors: DocumentIssue[]; warnings: DocumentIssue[] };

function kindsOf(doc: ModelDocument, species: string): Set<OrbitalKind> {
  return new Set(doc.sites.filter((s) => s.species === species).flatMap((s) => s.orbitals.map(orbitalKind)));
}

function checkLatticeAndSites(doc: ModelDocument, out: Issues): boolean {
  const { dimension, vectors } = doc.lattice;
  if (vectors.length !== dimension) {
    out.errors.push({ path: "lattice.vectors", message: `dimension is ${dimension} but ${vectors.length} primitive vectors are given` });
    return false;
  }
  if (cellMeasure(vectors) < 1e-6) {
    out.errors.push({ path: "lattice.vectors", message: "primitive vectors are linearly dependent (zero cell size)" });
    return false;
  }
  const labels = new Set<string>();
  doc.sites.forEach((site, i) => {
    if (labels.has(site.label)) out.errors.push({ path: `sites[${i}].label`, message: `duplicate site label "${site.label}"` });
    labels.add(site.label);
    if (new Set(site.orbitals).size !== site.orbitals.length) {
      out.errors.push({ path: `sites[${i}].orbitals`, message: "an orbital is listed twice" });
    }
  });
  return true;
}

function checkOnsite(doc: ModelDocument, out: Issues): void {
  for (const [species, energies] of Object.entries(doc.onsite)) {
    const present = new Set(doc.sites.filter((s) => s.species === species).flatMap((s) => s.orbitals));
    if (present.size === 0) out.errors.push({ path: `onsite.${species}`, message: `no site has species "${species}"` });
    for (const orbital of Object.keys(energies)) {
      if (!(ORBITALS as readonly string[]).includes(orbital)) {
        out.errors.push({ path: `onsite.${species}.${orbital}`, message: `unknown orbital "${orbital}" (allowed: ${ORBITALS.join(", ")})` });
      } else if (present.size && !present.has(orbital as Orbital)) {
        out.errors.push({ path: `onsite.${species}.${orbital}`, message: `no ${species} site has orbital ${orbital}` });
      }
    }
  }
  doc.sites.forEach((site, i) => {
    for (const orbital of site.orbitals) {
      if (doc.onsite[site.species]?.[orbital] === undefined) {
        out.errors.push({ path: `onsite.${site.species}.${orbital}`, message: `missing on-site energy for orbital ${orbital} of site ${site.label} (sites[${i}])` });
      }
    }
  });
}

function checkShellParams(doc: ModelDocument, shellIndex: number, out: Issues): void {
  const shell = doc.shells[shellIndex];
  const [a, b] = shell.species;
  const from = kindsOf(doc, a), to = kindsOf(doc, b);
  const path = `shells[${shellIndex}].params`;
  for (const [key, value] of Object.entries(shell.params)) {
    const parsed = parseBondKey(key);
    if (!parsed) continue;
    const mirrorOk = a === b && from.has(parsed.to) && to.has(parsed.from);
    if (!(from.has(parsed.from) && to.has(parsed.to)) && !mirrorOk) {
      out.errors.push({ path: `${path}.${key}`, message: `parameter for an orbital pair no site has: no ${a} site has a ${parsed.from} orbital or no ${b} site has a ${parsed.to} orbital` });
    }
    const mirror = mirrorBondKey(key);
    if (a === b && mirror !== key && shell.params[mirror] !== undefined && shell.params[mirror] !== value) {
      out.errors.push({ path: `${path}.${key}`, message: `one-species shell with ${key} ≠ ${mirror}: H would not be Hermitian (they are the same integral for one species)` });
    }
  }
  for (const k1 of from) {
    for (const k2 of to) {
      for (const m of bondSymmetries(k1, k2)) {
        const key = bondKey(k1, k2, m);
        if (shell.params[key] !== undefined || (a === b && shell.params[mirrorBondKey(key)] !== undefined)) continue;
        const why = a === b ? "" : ` (two-species shell: the ${k1} orbital sits on ${a}, the ${k2} orbital on ${b})`;
        out.errors.push({ path: `${path}.${key}`, message: `missing ${key}${why}; give 0 explicitly if the integral vanishes` });
      }
    }
  }
}

function checkShells(doc: ModelDocument, out: Issues): void {
  const vectors = doc.lattice.vectors;
  const reciprocal = reciprocalVectors(vectors);
  const positions = doc.sites.map((s) => s.position as Vec3);
  const seen = new Set<string>();
  let budget = BOND_SEARCH_BUDGET;
  doc.shells.forEach((shell, i) => {
    const [a, b] = shell.species;
    const unordered = [a, b].sort().join("|") + `|${shell.index}`;
    if (seen.has(unordered)) out.errors.push({ path: `shells[${i}]`, message: `shell ${shell.index} of ${a}–${b} is given twice (in either order)` });
    seen.add(unordered);
    const fromSites = doc.sites.flatMap((s, j) => (s.species === a ? [j] : []));
    const toSites = doc.sites.flatMap((s, j) => (s.species === b ? [j] : []));
    for (const [idx, sp] of [[0, a], [1, b]] as const) {
      if (!doc.sites.some((s) => s.species === sp)) out.errors.push({ path: `shells[${i}].species[${idx}]`, message: `no site has species "${sp}"` });
    }
    if (!fromSites.length || !toSites.length) return;
    checkShellParams(doc, i, out);
    const tol = shell.tolerance ?? DEFAULT_SHELL_TOLERANCE;
    const cost = bondSearchSize(reciprocal, positions, fromSites, toSites, shell.distance + tol);
    if (cost > budget) {
      out.errors.push({
        path: `shells[${i}].distance`,
        message: `shell distance ${shell.distance} Å reaches too far for this cell: finding its neighbours would compare ${cost.toLocaleString("en-US")} site pairs, and a document's shells may compare at most ${BOND_SEARCH_BUDGET.toLocaleString("en-US")} together`,
      });
      return;
    }
    budget -= cost;
    const bonds = findBonds(vectors, reciprocal, positions, fromSites, toSites, shell.distance - tol, shell.distance + tol);
    if (!bonds.length) {
      const reach = shell.distance * 1.5 + 1;
      const hintCost = bondSearchSize(reciprocal, positions, fromSites, toSites, reach);
      const near = hintCost <= budget ? distinctBondLengths(vectors, reciprocal, positions, fromSites, toSites, reach).slice(0, 4) : null;
      budget -= Math.min(budget, hintCost);
      const hint = near ? ` (nearest distances: ${near.join(", ") || "none"} Å)` : "";
      out.errors.push({ path: `shells[${i}].distance`, message: `shell distance ${shell.distance} Å matches no ${a}–${b} neighbour within ${tol} Å${hint}` });
    }
  });
}

function checkHoppings(doc: ModelDocument, out: Issues): void {
  const seen = new Set<string>();
  (doc.hoppings ?? []).forEach((h, i) => {
    const path = `hoppings[${i}]`;
    for (const end of ["from", "to"] as const) {
      const site = doc.sites.find((s) => s.label === h[end].site);
      if (!site) out.errors.push({ path: `${path}.${end}.site`, message: `no site labelled "${h[end].site}"` });
      else if (!site.orbitals.includes(h[end].orbital)) out.errors.push({ path: `${path}.${end}.orbital`, message: `site ${site.label} has no orbital ${h[end].orbital}` });
    }
    if (h.translation.length !== doc.lattice.dimension) {
      out.errors.push({ path: `${path}.translation`, message: `needs ${doc.lattice.dimension} integer components (the lattice dimension), got ${h.translation.length}` });
    }
    const a = `${h.from.site}:${h.from.orbital}`, b = `${h.to.site}:${h.to.orbital}`;
    if (a === b && h.translation.every((t) => t === 0)) out.errors.push({ path, message: "an orbital coupled to itself in the same cell is an on-site energy: use onsite" });
    const key = `${a}>${b}>${h.translation.join(",")}`;
    const reverse = `${b}>${a}>${h.translation.map((t) => -t + 0).join(",")}`;
    if (seen.has(key) || seen.has(reverse)) out.errors.push({ path, message: "duplicate hopping (the same pair and translation, or its Hermitian conjugate, is already listed)" });
    seen.add(key);
  });
}

function checkSpinOrbit(doc: ModelDocument, out: Issues): void {
  for (const species of Object.keys(doc.spinOrbit ?? {})) {
    const sites = doc.sites.filter((s) => s.species === species);
    if (!sites.length) out.errors.push({ path: `spinOrbit.${species}`, message: `no site has species "${species}"` });
    for (const site of sites) {
      if (!["px", "py", "pz"].every((p) => site.orbitals.includes(p as Orbital))) {
        out.errors.push({ path: `spinOrbit.${species}`, message: `site ${site.label} lacks a full p shell (px, py, pz), which λ L·S needs` });
      }
    }
  }
}

function checkPathAndCounts(doc: ModelDocument, out: Issues): void {
  const d = doc.lattice.dimension;
  const kp = doc.kPath;
  if (kp.type === "standard") {
    if (STANDARD_PATHS[kp.lattice].dimension !== d) out.errors.push({ path: "kPath.lattice", message: `${kp.lattice} paths need a ${STANDARD_PATHS[kp.lattice].dimension}-dimensional lattice, this one is ${d}-dimensional` });
    else if (!matchStandardLattice(kp.lattice, doc.lattice.vectors)) out.errors.push({ path: "kPath.lattice", message: `the primitive vectors do not form a ${kp.lattice} lattice` });
  } else {
    for (const [label, f] of Object.entries(kp.points)) {
      if (f.length !== d) out.errors.push({ path: `kPath.points.${label}`, message: `needs ${d} fractional components, got ${f.length}` });
    }
    kp.segments.forEach((run, i) => run.forEach((label, j) => {
      if (!kp.points[label]) out.errors.push({ path: `kPath.segments[${i}][${j}]`, message: `label "${label}" is not among kPath.points` });
    }));
  }
  const states = doc.sites.reduce((n, s) => n + s.orbitals.length, 0) * 2;
  if (doc.electronCount > states) out.errors.push({ path: "electronCount", message: `${doc.electronCount} electrons exceed the ${states} states of the basis` });
}

function checkCitations(doc: ModelDocument, out: Issues): void {
  const keys = new Set(listParameters(doc).map((p) => p.key));
  for (const key of Object.keys(doc.provenance.citations)) {
    if (!keys.has(key)) out.errors.push({ path: `provenance.citations.${key}`, message: `no parameter has the key "${key}"` });
  }
  for (const key of keys) {
    if (!key.endsWith("/im") && doc.provenance.citations[key] === undefined) {
      out.warnings.push({ path: `provenance.citations.${key}`, message: "parameter has no citation or stated reason" });
    }
  }
}

/** Checks of meaning that a schema cannot express. */
export function validateSemantics(doc: ModelDocument): Issues {
  const out: Issues = { errors: [], warnings: [] };
  out.errors.push(...checkConventions(doc.conventions, Object.keys(doc.spinOrbit ?? {}).length > 0));
  if (!checkLatticeAndSites(doc, out)) return out;
  checkOnsite(doc, out);
  checkShells(doc, out);
  checkHoppings(doc, out);
  checkSpinOrbit(doc, out);
  checkPathAndCounts(doc, out);
  checkCitations(doc, out);
  return out;
}
