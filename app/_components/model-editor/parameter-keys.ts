import { shellKey } from "@/lib/tb/parameters";
import { angularMomentum, bondKey, bondSymmetries, mirrorBondKey, type OrbitalKind } from "@/lib/tb/orbitals";
import type { Draft } from "./draft-path";
import { asArray, asRecord, readShells } from "./draft-read";

const KIND_ORDER: OrbitalKind[] = ["s", "p", "d", "s*"];

/**
 * The Slater–Koster keys a shell needs for the orbital kinds on its two species. On a one-species shell a key and
 * its mirror are one integral, so only one is listed: the one already in the shell, else the one with the lower ℓ first
 * ("sp_sigma" rather than "ps_sigma").
 */
export function requiredBondKeys(from: ReadonlySet<OrbitalKind>, to: ReadonlySet<OrbitalKind>, sameSpecies: boolean, existing: Record<string, unknown>): string[] {
  const out: string[] = [];
  for (const k1 of KIND_ORDER.filter((k) => from.has(k))) {
    for (const k2 of KIND_ORDER.filter((k) => to.has(k))) {
      for (const m of bondSymmetries(k1, k2)) {
        const key = bondKey(k1, k2, m);
        const mirror = mirrorBondKey(key);
        if (!sameSpecies) out.push(key);
        else if (!out.includes(key) && !out.includes(mirror)) {
          const keep = key in existing || (!(mirror in existing) && angularMomentum(k1) <= angularMomentum(k2));
          out.push(keep ? key : mirror);
        }
      }
    }
  }
  return out;
}

/** Every scalar parameter of a draft by its stable key (the keys of lib/tb/parameters listParameters), values unchecked. */
export function looseParameterValues(draft: unknown): Map<string, unknown> {
  const doc = asRecord(draft) as Draft;
  const out = new Map<string, unknown>();
  for (const [species, energies] of Object.entries(asRecord(doc.onsite))) {
    for (const [orbital, value] of Object.entries(asRecord(energies))) out.set(`onsite/${species}/${orbital}`, value);
  }
  for (const shell of readShells(doc)) {
    if (shell.index === null) continue;
    for (const [name, value] of Object.entries(shell.params)) out.set(`shell/${shellKey(shell.species, shell.index)}/${name}`, value);
  }
  for (const [species, value] of Object.entries(asRecord(doc.spinOrbit))) out.set(`soc/${species}`, value);
  asArray(doc.hoppings).forEach((raw, i) => {
    const value = asRecord(asRecord(raw).value);
    out.set(`hopping/${i}/re`, value.re);
    out.set(`hopping/${i}/im`, value.im ?? 0);
  });
  return out;
}

/** Parameters whose value differs from the base's (or that the base lacks): each needs its own citation or reason. */
export function changedParameterKeys(draft: unknown, base: unknown | null): string[] {
  const baseValues = base === null ? new Map<string, unknown>() : looseParameterValues(base);
  return [...looseParameterValues(draft)].filter(([key, value]) => !baseValues.has(key) || baseValues.get(key) !== value).map(([key]) => key);
}
