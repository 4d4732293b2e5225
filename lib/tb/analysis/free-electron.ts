import { HBAR2_OVER_2ME } from "./constants";
import { kLength } from "./k-geometry";

/**
 * Free-electron comparison of the lowest band: least-squares fit of E(k) − E(Γ) = (ħ²/2mₑ)·k²/(m* / mₑ)
 * over the samples with 0 < |k| ≤ radius (ħ²/2mₑ = 3.80998 eV·Å², CODATA 2018), and the deviation
 * of the band from that parabola at every sample. |k| is measured from the origin of the given kFrac.
 */
export interface FreeElectronInput {
  kFrac: number[][];
  /** Lowest-band energy at each kFrac. */
  energies: ArrayLike<number>;
  gammaEnergy: number;
  reciprocal: number[][];
  /** Fit radius in Å⁻¹. Default 0.2 Å⁻¹. */
  radius?: number;
}

export interface FreeElectronResult {
  massRatio: number;
  /** ħ²/(2m* ) in eV·Å². */
  coefficient: number;
  radius: number;
  pointsUsed: number;
  /** E(k) − [E(Γ) + ħ²k²/2m* ] per sample, eV. */
  deviation: Float64Array;
  maxDeviationInRadius: number;
}

export function compareFreeElectron(input: FreeElectronInput): FreeElectronResult {
  const radius = input.radius ?? 0.2;
  if (input.energies.length !== input.kFrac.length) throw new Error("free-electron: energies and kFrac must match");
  const k2 = input.kFrac.map((k) => kLength(input.reciprocal, k) ** 2);
  let num = 0;
  let den = 0;
  let used = 0;
  k2.forEach((q, i) => {
    if (q > 0 && q <= radius * radius) {
      num += (input.energies[i] - input.gammaEnergy) * q;
      den += q * q;
      used++;
    }
  });
  if (used === 0) throw new Error(`free-electron: no samples within ${radius} Å⁻¹ of Γ`);
  const coefficient = num / den;
  const deviation = Float64Array.from(k2, (q, i) => input.energies[i] - input.gammaEnergy - coefficient * q);
  let maxDeviationInRadius = 0;
  k2.forEach((q, i) => {
    if (q <= radius * radius) maxDeviationInRadius = Math.max(maxDeviationInRadius, Math.abs(deviation[i]));
  });
  return { massRatio: HBAR2_OVER_2ME / coefficient, coefficient, radius, pointsUsed: used, deviation, maxDeviationInRadius };
}
