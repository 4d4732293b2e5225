import { linearScale, niceTicks } from "@/lib/plot/scale";

const W = 760;
const H = 180;
const M = { left: 56, right: 16, top: 10, bottom: 28 };

/** Fitted − reference (meV) at every value in the fit, along the path: where the fit is good and where it is not. */
export function ResidualPlot({ residuals, distance, ticks, title }: { residuals: [number, number, number][]; distance: number[]; ticks: { index: number; label: string }[]; title: string }) {
  const meV = residuals.map((r) => r[1] * 1000);
  const top = Math.max(1e-3, ...meV.map(Math.abs)) * 1.1;
  const x = linearScale([distance[0] ?? 0, distance[distance.length - 1] ?? 1], [M.left, W - M.right]);
  const y = linearScale([-top, top], [H - M.bottom, M.top]);
  return (
    <figure className="rounded-xl border border-rule bg-card p-3">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label={title}>
        <title>{title}</title>
        {niceTicks(-top, top, 4).map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={t === 0 ? "var(--color-ink-soft)" : "var(--color-rule)"} strokeWidth={t === 0 ? 1 : 0.6} />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize={11} className="num" fill="var(--color-ink-soft)">
              {Math.abs(t) < 1e-9 ? 0 : t}
            </text>
          </g>
        ))}
        {ticks.map((t, i) => (
          <g key={`t${i}`}>
            <line x1={x(distance[t.index])} x2={x(distance[t.index])} y1={M.top} y2={H - M.bottom} stroke="var(--color-rule)" strokeWidth={0.8} />
            {i > 0 && distance[ticks[i - 1].index] === distance[t.index] ? null : (
              <text x={x(distance[t.index])} y={H - M.bottom + 14} textAnchor="middle" fontSize={11} fill="var(--color-ink)">
                {ticks.filter((u) => distance[u.index] === distance[t.index]).map((u) => u.label).join("|")}
              </text>
            )}
          </g>
        ))}
        {residuals.map(([d], i) => (
          <circle key={i} cx={x(d)} cy={y(meV[i])} r={1.8} fill="var(--color-violet-dot)" fillOpacity={0.7} />
        ))}
        <text x={12} y={M.top + 4} fontSize={11} fill="var(--color-ink-soft)" transform={`rotate(-90 12 ${M.top + 4})`} textAnchor="end">
          ΔE (meV)
        </text>
      </svg>
      <figcaption className="mt-1 text-xs text-ink-soft">Fitted model minus aligned reference at every value in the fit; the horizontal axis is the position along the default path.</figcaption>
    </figure>
  );
}
