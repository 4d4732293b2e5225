/**
 * Number formatting and the neutral heat scale shared by the diff tables. Magnitudes map onto a log scale fixed per
 * column (not per table), so the same change is shaded the same on every proposal; the value is always printed too.
 */
const MINUS = "−";

/** Fixed decimals with a true minus sign; a non-zero value that would round to zero says "<0.0001" and keeps its sign. */
export function formatFixed(value: number, digits: number, signed = false): string {
  const text = Math.abs(value).toFixed(digits);
  const sign = value < 0 ? MINUS : signed && value > 0 ? "+" : "";
  if (value !== 0 && Number(text) === 0) return `${sign}<${(10 ** -digits).toFixed(digits)}`;
  return `${Number(text) === 0 ? "" : sign}${text}`;
}

/** |ΔE| in eV. */
export function formatEnergy(value: number): string {
  return formatFixed(value, 4);
}

export function formatPercent(value: number): string {
  return `${formatFixed(value, 1, true)} %`;
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
