/**
 * Units accepted in uploaded reference bands, with their conversion to Bandgate's eV and 1/Å.
 * Constants: CODATA 2018 recommended values (E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor,
 * Rev. Mod. Phys. 93, 025010 (2021)).
 */

/** Rydberg energy R∞hc in eV, CODATA 2018. */
export const RYDBERG_EV = 13.605693122994;
/** Hartree energy E_h in eV, CODATA 2018. */
export const HARTREE_EV = 27.211386245988;
/** Bohr radius a₀ in Å, CODATA 2018 (0.529177210903 × 10⁻¹⁰ m). */
export const BOHR_ANGSTROM = 0.529177210903;

export type EnergyUnit = "eV" | "meV" | "Ry" | "Hartree";

export const ENERGY_UNIT_FACTORS: Record<EnergyUnit, number> = {
  eV: 1,
  meV: 1e-3,
  Ry: RYDBERG_EV,
  Hartree: HARTREE_EV,
};

// Case matters only where it must: "meV" is not "MeV".
const ENERGY_SPELLINGS: Record<string, EnergyUnit> = {
  eV: "eV", ev: "eV",
  meV: "meV",
  Ry: "Ry", ry: "Ry", Ryd: "Ry", Rydberg: "Ry", rydberg: "Ry",
  Ha: "Hartree", Hartree: "Hartree", hartree: "Hartree", Eh: "Hartree", E_h: "Hartree",
};

export const ENERGY_UNITS_HINT = "eV, meV, Ry or Hartree";

export function energyUnitOf(text: string): EnergyUnit | null {
  return ENERGY_SPELLINGS[text.trim()] ?? null;
}

const INVERSE_LENGTHS: Record<string, number> = {
  angstrom: 1,
  ang: 1,
  a: 1,
  nm: 0.1,
  bohr: 1 / BOHR_ANGSTROM,
};

export const PATH_UNITS_HINT = "1/angstrom, 1/nm or 1/bohr";

/** Factor from the given inverse-length unit to 1/Å, or null when the unit is not one we read. */
export function inverseLengthFactor(text: string): number | null {
  const s = text.replace(/\s+/g, "").toLowerCase().replace(/å/g, "angstrom");
  const m = /^(?:1\/([a-z]+)|([a-z]+)\^?-1)$/.exec(s);
  if (!m) return null;
  return INVERSE_LENGTHS[m[1] ?? m[2]] ?? null;
}
