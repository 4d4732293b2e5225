import { computeBands } from "../bands";
import type { ModelDocument } from "../document";
import { compileModel } from "../model";
import { orbitalKind, parseBondKey, type Orbital, type OrbitalKind } from "../orbitals";
import { listParameters, setParameters } from "../parameters";
import { solveSignFlips, type SignConstraint } from "./gauge-parity";
import { monkhorstPackMesh } from "./mesh";

/**
 * Is a parameter change only an orbital phase (gauge) change? Multiplying every orbital of one kind (s, s*, p, d)
 * on one species by −1 is a unitary change of basis: every eigenvalue stays, and each two-centre integral
 * ⟨t1 on A|H|t2 on B⟩ is multiplied by σ(A,t1)·σ(B,t2) while on-site and spin–orbit terms (same atom, same kind) stay.
 * The change is explained when such signs exist for every parameter; the bands are then compared numerically too.
 */
export interface OrbitalFlip {
  species: string;
  kind: OrbitalKind;
}

export interface GaugeVerdict {
  status: "identical" | "no physical change" | "physical change";
  flips: OrbitalFlip[];
  explanation: string;
  changedParameters: string[];
  /** Largest |ΔE| over the check k-points (eV). */
  maxBandShift: number;
}

const KIND_ORDER: OrbitalKind[] = ["s", "s*", "p", "d"];

export function checkGaugeChange(before: ModelDocument, after: ModelDocument, opts: { tolerance?: number; kFrac?: number[][] } = {}): GaugeVerdict {
  const tol = opts.tolerance ?? 1e-9;
  const kFrac = opts.kFrac ?? monkhorstPackMesh(new Array<number>(before.lattice.dimension).fill(4)).kFrac;
  const oldParams = listParameters(before);
  const newParams = new Map(listParameters(after).map((p) => [p.key, p.value]));
  const structureSame = oldParams.length === newParams.size && oldParams.every((p) => newParams.has(p.key)) && sameStructure(before, after);
  const changedParameters = oldParams.filter((p) => newParams.get(p.key) !== p.value).map((p) => p.key);
  const maxBandShift = structureSame ? bandShift(before, after, kFrac) : Infinity;
  const verdict = (status: GaugeVerdict["status"], explanation: string, flips: OrbitalFlip[] = []): GaugeVerdict =>
    ({ status, flips, explanation, changedParameters, maxBandShift });
  if (!structureSame) return verdict("physical change", "the structure (lattice, sites, orbitals, shells or hoppings) changed, not only parameter values");
  if (changedParameters.length === 0) return verdict("identical", "no parameter changed");
  const constraints: SignConstraint[] = [];
  const variables = new Set<string>();
  for (const p of oldParams) {
    const v = p.value;
    const w = newParams.get(p.key) as number;
    const scale = tol * Math.max(1, Math.abs(v));
    if (Math.abs(Math.abs(w) - Math.abs(v)) > scale) return verdict("physical change", `${p.label} changed in magnitude (${v} → ${w})`);
    if (Math.abs(v) <= scale) continue;
    const flip = Math.abs(w - v) > scale;
    const ends = endpointsOf(before, p.key);
    if (!ends) {
      if (flip) return verdict("physical change", `${p.label} changed sign; an orbital phase cannot change an on-site or spin–orbit term`);
      continue;
    }
    ends.forEach((e) => variables.add(e));
    constraints.push({ a: ends[0], b: ends[1], flip, source: p.label });
  }
  const ordered = [...variables].sort((x, y) => kindRank(x) - kindRank(y) || x.localeCompare(y));
  const solution = solveSignFlips(ordered, constraints);
  if (!solution.consistent) {
    if (maxBandShift <= 1e-8) return verdict("no physical change", "the bands are unchanged, but no sign flip of a whole orbital kind on a species explains the change");
    return verdict("physical change", `no orbital sign flip explains the sign change of ${solution.conflict} together with the other parameters`);
  }
  const flips = solution.flipped.map((v) => {
    const [species, kind] = v.split("|");
    return { species, kind: kind as OrbitalKind };
  });
  const what = flips.map((f) => `every ${f.kind} orbital on ${f.species}`).join(", ");
  return verdict("no physical change", `equivalent to flipping the sign of ${what}; bands unchanged (max |ΔE| ${maxBandShift.toExponential(1)} eV)`, flips);
}

function kindRank(v: string): number {
  return KIND_ORDER.indexOf(v.split("|")[1] as OrbitalKind);
}

/** The two (species|kind) variables a parameter couples, or null for on-site and spin–orbit terms. */
function endpointsOf(doc: ModelDocument, key: string): [string, string] | null {
  const parts = key.split("/");
  if (parts[0] === "shell") {
    const [a, b] = parts[1].split("-");
    const bond = parseBondKey(parts[3]);
    if (!bond) throw new Error(`gauge: cannot read bond key ${parts[3]}`);
    return [`${a}|${bond.from}`, `${b}|${bond.to}`];
  }
  if (parts[0] === "hopping") {
    const h = (doc.hoppings ?? [])[Number(parts[1])];
    const end = (ref: { site: string; orbital: Orbital }) =>
      `${doc.sites.find((s) => s.label === ref.site)?.species}|${orbitalKind(ref.orbital)}`;
    return [end(h.from), end(h.to)];
  }
  return null;
}

function sameStructure(a: ModelDocument, b: ModelDocument): boolean {
  const zero = (d: ModelDocument) => {
    const z = setParameters(d, Object.fromEntries(listParameters(d).map((p) => [p.key, 0])));
    return stableJson({ lattice: z.lattice, sites: z.sites, shells: z.shells, hoppings: z.hoppings ?? [], spinOrbit: z.spinOrbit ?? {}, onsite: z.onsite, phase: z.conventions.blochPhase });
  };
  return zero(a) === zero(b);
}

function stableJson(x: unknown): string {
  if (Array.isArray(x)) return `[${x.map(stableJson).join(",")}]`;
  if (x && typeof x === "object") {
    return `{${Object.keys(x).sort().map((k) => `${JSON.stringify(k)}:${stableJson((x as Record<string, unknown>)[k])}`).join(",")}}`;
  }
  return JSON.stringify(x);
}

function bandShift(a: ModelDocument, b: ModelDocument, kFrac: number[][]): number {
  const ea = computeBands(compileModel(a), kFrac).energies;
  const eb = computeBands(compileModel(b), kFrac).energies;
  let max = 0;
  ea.forEach((row, k) => row.forEach((e, n) => (max = Math.max(max, Math.abs(e - eb[k][n])))));
  return max;
}
