/** Orbital names allowed in a model document, in the canonical order used for validation messages. */
export const ORBITALS = ["s", "px", "py", "pz", "dxy", "dyz", "dzx", "dx2-y2", "dz2", "s*"] as const;
export type Orbital = (typeof ORBITALS)[number];

/** Orbital kind used in Slater–Koster keys: s* is an excited s-like state with its own integrals. */
export type OrbitalKind = "s" | "s*" | "p" | "d";

export const BOND_SYMMETRIES = ["sigma", "pi", "delta"] as const;
export type BondSymmetry = (typeof BOND_SYMMETRIES)[number];

export function orbitalKind(o: Orbital): OrbitalKind {
  if (o === "s" || o === "s*") return o;
  return o.startsWith("p") ? "p" : "d";
}

export function angularMomentum(kind: OrbitalKind): 0 | 1 | 2 {
  return kind === "p" ? 1 : kind === "d" ? 2 : 0;
}

/** Symmetries that exist for a pair of kinds: σ always, π when both ℓ ≥ 1, δ when both ℓ = 2. */
export function bondSymmetries(k1: OrbitalKind, k2: OrbitalKind): BondSymmetry[] {
  const lmin = Math.min(angularMomentum(k1), angularMomentum(k2));
  return BOND_SYMMETRIES.slice(0, lmin + 1);
}

export function bondKey(k1: OrbitalKind, k2: OrbitalKind, m: BondSymmetry): string {
  return `${k1}${k2}_${m}`;
}

const KINDS: OrbitalKind[] = ["s", "s*", "p", "d"];

/** Every valid Slater–Koster key, e.g. "sp_sigma", "ps_sigma", "s*p_sigma", "dd_delta". */
export const BOND_KEYS: readonly string[] = KINDS.flatMap((k1) =>
  KINDS.flatMap((k2) => bondSymmetries(k1, k2).map((m) => bondKey(k1, k2, m))),
);

export function parseBondKey(key: string): { from: OrbitalKind; to: OrbitalKind; m: BondSymmetry } | null {
  const match = /^(s\*|s|p|d)(s\*|s|p|d)_(sigma|pi|delta)$/.exec(key);
  if (!match) return null;
  const [, from, to, m] = match as unknown as [string, OrbitalKind, OrbitalKind, BondSymmetry];
  return bondSymmetries(from, to).includes(m) ? { from, to, m } : null;
}

/** The key with the two atoms' roles swapped ("sp_sigma" ↔ "ps_sigma"). */
export function mirrorBondKey(key: string): string {
  const parsed = parseBondKey(key);
  if (!parsed) return key;
  return bondKey(parsed.to, parsed.from, parsed.m);
}
