import { linearScale, niceTicks } from "@/lib/plot/scale";

type CostPoint = [number, number, number];

/** Cost ½Σw·ΔE² (eV²) per accepted iteration on a log scale: how the fit went down. */
export function CostHistoryPlot({ history, title, compact = false }: { history: CostPoint[]; title: string; compact?: boolean }) {
  const W = compact ? 120 : 520;
  const H = compact ? 28 : 220;
  const M = compact ? { left: 1, right: 1, top: 2, bottom: 2 } : { left: 56, right: 12, top: 12, bottom: 34 };
  const points = history.filter((p) => p[1] > 0);
  if (points.length === 0) return compact ? <span className="text-xs text-ink-soft">no steps yet</span> : <p className="text-sm text-ink-soft">No iterations recorded yet.</p>;
  const logs = points.map((p) => Math.log10(p[1]));
  const lo = Math.min(...logs);
  const hi = Math.max(...logs);
  const pad = hi - lo < 0.5 ? 0.25 : 0.05 * (hi - lo);
  const x = linearScale([points[0][0], Math.max(points[points.length - 1][0], points[0][0] + 1)], [M.left, W - M.right]);
  const y = linearScale([lo - pad, hi + pad], [H - M.bottom, M.top]);
  const line = points.map((p, i) => `${x(p[0]).toFixed(1)},${y(logs[i]).toFixed(1)}`).join(" ");
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className={compact ? "h-7 w-[120px]" : "h-auto w-full max-w-xl"} role="img" aria-label={title}>
      <title>{title}</title>
      {compact
        ? null
        : niceTicks(lo - pad, hi + pad, 5).map((t) => (
            <g key={t}>
              <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke="var(--color-rule)" strokeWidth={0.6} />
              <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize={11} className="num" fill="var(--color-ink-soft)">
                {`1e${Number.isInteger(t) ? t : t.toFixed(1)}`}
              </text>
            </g>
          ))}
      <polyline points={line} fill="none" stroke="var(--color-copper-deep)" strokeWidth={compact ? 1.2 : 1.6} />
      {compact ? null : (
        <>
          <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle" fontSize={11} fill="var(--color-ink-soft)">
            iteration
          </text>
          <text x={12} y={M.top + 4} fontSize={11} fill="var(--color-ink-soft)" transform={`rotate(-90 12 ${M.top + 4})`} textAnchor="end">
            cost (eV²)
          </text>
        </>
      )}
    </svg>
  );
}
