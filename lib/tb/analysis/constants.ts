/** ħ²/mₑ in eV·Å² (CODATA 2018: ħ²/(2mₑ) = 3.80998 eV·Å²). */
export const HBAR2_OVER_ME = 7.61996;
/** ħ²/(2mₑ) in eV·Å² (CODATA 2018). */
export const HBAR2_OVER_2ME = 3.80998;

/** Band energies at one k-point, ascending. */
export type LevelList = ArrayLike<number>;
/** Returns the band energies (ascending) at a fractional k-point. */
export type EnergySolver = (kFrac: number[]) => Float64Array;
/** Electrons per band state: 2 without spin–orbit (spin-degenerate basis), 1 with it. */
export type SpinDegeneracy = 1 | 2;
