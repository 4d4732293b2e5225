import { bandPathData, niceTicks, linearScale, type LinearScale } from "@/lib/plot/scale";
import { CHART } from "@/lib/review/band-plot-layout";

export type DeltaMode = "max" | "per-band";

const B = CHART.bands;
const D = CHART.delta;

/** ΔE(k) = proposed − base beneath the bands, on the same x axis: the largest |ΔE| per k, or every band's ΔE. */
export function PlotDelta({ distance, delta, mode, x, hasBase }: { distance: number[]; delta: { perK: number[]; perBandK: number[][] }; mode: DeltaMode; x: LinearScale; hasBase: boolean }) {
  const [k0, k1] = x.domain;
  const inView = (i: number) => distance[i] >= k0 - 1e-9 && distance[i] <= k1 + 1e-9;
  const values = mode === "max" ? delta.perK.filter((_, i) => inView(i)) : delta.perBandK.flatMap((row, i) => (inView(i) ? row : []));
  const top = Math.max(1e-3, ...values.map(Math.abs));
  const y = linearScale(mode === "max" ? [0, top * 1.1] : [-top * 1.1, top * 1.1], [D.bottom, D.top]);
  const bands = delta.perBandK[0]?.length ?? 0;
  const label = mode === "max" ? "max |ΔE| (eV)" : "ΔE (eV)";
  return (
    <g>
      <defs>
        <clipPath id="delta-area">
          <rect x={B.left} y={D.top} width={B.right - B.left} height={D.bottom - D.top} />
        </clipPath>
      </defs>
      <rect x={B.left} y={D.top} width={B.right - B.left} height={D.bottom - D.top} fill="var(--color-card)" stroke="var(--color-rule)" />
      {hasBase
        ? niceTicks(y.domain[0], y.domain[1], 3).map((v) => (
            <g key={v}>
              <line x1={B.left} x2={B.right} y1={y(v)} y2={y(v)} stroke="var(--color-rule)" strokeWidth={v === 0 ? 1 : 0.5} />
              <text x={B.left - 6} y={y(v) + 4} textAnchor="end" className="num" fontSize={10} fill="var(--color-ink-soft)">
                {(Math.abs(v) < 1e-12 ? 0 : v).toPrecision(2).replace("-", "−")}
              </text>
            </g>
          ))
        : null}
      <g clipPath="url(#delta-area)">
        {!hasBase ? null : mode === "max" ? (
          <path d={`${bandPathData(distance, delta.perK, x, y)}`} fill="none" stroke="var(--color-copper-deep)" strokeWidth={1.4} />
        ) : (
          Array.from({ length: bands }, (_, n) => (
            <path key={n} d={bandPathData(distance, delta.perBandK.map((r) => r[n]), x, y)} fill="none" stroke="var(--color-slate-line)" strokeWidth={1} opacity={0.8} />
          ))
        )}
      </g>
      {!hasBase ? (
        <text x={(B.left + B.right) / 2} y={(D.top + D.bottom) / 2 + 4} textAnchor="middle" fontSize={12} fill="var(--color-ink-soft)">
          No base release: nothing to subtract
        </text>
      ) : null}
      <text x={16} y={(D.top + D.bottom) / 2} transform={`rotate(-90 16 ${(D.top + D.bottom) / 2})`} textAnchor="middle" fontSize={11} fill="var(--color-ink-soft)">
        {label}
      </text>
    </g>
  );
}
