/** Plot arithmetic kept apart from React so it can be tested alone. */

export interface LinearScale {
  (value: number): number;
  domain: [number, number];
}

export function linearScale(domain: [number, number], range: [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0 || 1;
  const scale = ((v: number) => r0 + ((v - d0) / span) * (r1 - r0)) as LinearScale;
  scale.domain = domain;
  return scale;
}

/** Round tick values (1, 2, 5 × 10ⁿ) covering [lo, hi] with about `count` steps. */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return ticks;
}

/** Energy range of all series with a small margin, or the given window. */
export function energyExtent(series: readonly (readonly (readonly number[])[])[], pad = 0.05): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const rows of series) {
    for (const row of rows) {
      for (const e of row) {
        if (!Number.isFinite(e)) continue;
        lo = Math.min(lo, e);
        hi = Math.max(hi, e);
      }
    }
  }
  if (!Number.isFinite(lo)) return [-1, 1];
  const margin = (hi - lo || 1) * pad;
  return [lo - margin, hi + margin];
}

/**
 * SVG path data for one band along a path; a new sub-path starts where the path jumps (two points share a distance,
 * as at "U|K" breaks) or where a value is missing.
 */
export function bandPathData(distance: readonly number[], values: readonly (number | null)[], x: (v: number) => number, y: (v: number) => number): string {
  let d = "";
  let pen = false;
  for (let i = 0; i < distance.length; i++) {
    const v = values[i];
    const jump = i > 0 && distance[i] === distance[i - 1];
    if (v === null || v === undefined || !Number.isFinite(v)) {
      pen = false;
      continue;
    }
    d += `${pen && !jump ? "L" : "M"}${x(distance[i]).toFixed(1)} ${y(v).toFixed(1)}`;
    pen = true;
  }
  return d;
}

export function formatEnergy(v: number): string {
  return v.toFixed(Math.abs(v) >= 10 ? 0 : 1).replace("-", "−");
}
