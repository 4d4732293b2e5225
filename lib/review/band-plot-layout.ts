import { energyExtent, linearScale, type LinearScale } from "@/lib/plot/scale";

/** Geometry of the review band chart: bands on top, ΔE(k) beneath on the same x axis, DOS to the right. */
export const CHART = {
  width: 960,
  height: 560,
  bands: { left: 60, right: 742, top: 14, bottom: 360 },
  delta: { top: 392, bottom: 512 },
  dos: { left: 764, right: 944 },
  tickLabelY: 534,
} as const;

export interface ChartScales {
  x: LinearScale;
  y: LinearScale;
}

export type Range = [number, number];

/** x from the k-range (or the whole path), y from the energy range (or every visible series with a margin). */
export function chartScales(distance: readonly number[], kRange: Range | null, eRange: Range | null, series: (number | null)[][][]): ChartScales {
  const k: Range = kRange ?? [distance[0] ?? 0, distance[distance.length - 1] ?? 1];
  const e: Range = eRange ?? energyExtent(series.map((rows) => rows.map((row) => row.filter((v): v is number => v !== null))));
  return {
    x: linearScale(k, [CHART.bands.left, CHART.bands.right]),
    y: linearScale(e, [CHART.bands.bottom, CHART.bands.top]),
  };
}

/** Inverse of a linear scale (chart units back to data), for pointer selections. */
export function invert(scale: LinearScale, v: number): number {
  const [d0, d1] = scale.domain;
  const r0 = scale(d0);
  const r1 = scale(d1);
  return d0 + ((v - r0) / (r1 - r0 || 1)) * (d1 - d0);
}

/** A range with its ends in order, or null when it is empty or not a number. */
export function orderedRange(a: number, b: number): Range | null {
  if (!Number.isFinite(a) || !Number.isFinite(b) || a === b) return null;
  return a < b ? [a, b] : [b, a];
}
