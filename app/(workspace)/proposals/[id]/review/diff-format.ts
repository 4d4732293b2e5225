/**
 * Number formatting and the neutral heat scale shared by the diff tables. Magnitudes map onto a log scale fixed per
 * column (not per table), so the same change is shaded the same on every proposal; the value is always printed too.
 */
const MINUS = "−";

export function formatFixed(value: number, digits: number, signed = false): string {
  const text = Math.abs(value).toFixed(digits);
  const zero = Number(text) === 0;
  const sign = value < 0 && !zero ? MINUS : signed && !zero ? "+" : signed ? "±" : "";
  return `${sign}${text}`;
}

/** |ΔE| in eV with four decimals; a non-zero value below the last digit says so instead of printing zero. */
export function formatEnergy(value: number): string {
  return value !== 0 && Math.abs(value) < 5e-5 ? "<0.0001" : formatFixed(value, 4);
}

export interface HeatScale {
  /** Magnitude shaded as the faintest step. */
  low: number;
  /** Magnitude (and above) shaded as the strongest step. */
  high: number;
}

export const ENERGY_HEAT: HeatScale = { low: 1e-3, high: 1 };
export const PERCENT_HEAT: HeatScale = { low: 0.1, high: 100 };

export function heatLevel(value: number | null, scale: HeatScale): number {
  if (value === null || value === 0 || !Number.isFinite(value)) return 0;
  const t = Math.log10(Math.abs(value) / scale.low) / Math.log10(scale.high / scale.low);
  return Math.min(1, Math.max(0.05, t));
}

/** Warm paper (level 0) to a copper mix that still keeps ink text at good contrast (level 1). */
export function heatBackground(level: number): string | undefined {
  if (level <= 0) return undefined;
  return `color-mix(in oklab, var(--color-copper) ${Math.round(8 + level * 42)}%, var(--color-card))`;
}
