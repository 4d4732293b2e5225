import { bandPathData, energyExtent, formatEnergy, linearScale, niceTicks } from "@/lib/plot/scale";

export type BandSeriesRole = "base" | "proposal" | "reference";

export interface BandSeries {
  role: BandSeriesRole;
  label: string;
  /** Per k-point, the band energies (eV); null where a reference has no value. */
  energies: (number | null)[][];
  /** Path distance of each point when it differs from the plot's (reference sets on their own k-points). */
  distance?: number[];
}

const STYLE: Record<BandSeriesRole, { stroke: string; dash?: string; width: number }> = {
  base: { stroke: "var(--color-slate-line)", dash: "5 4", width: 1.4 },
  proposal: { stroke: "var(--color-teal-line)", width: 1.8 },
  reference: { stroke: "var(--color-violet-dot)", width: 0 },
};

/** Two labels at one distance (a break in the path, e.g. U and K) share one line: "U|K". */
function mergeTicks(distance: number[], ticks: { index: number; label: string }[]) {
  const merged: { index: number; label: string }[] = [];
  for (const t of ticks) {
    const last = merged[merged.length - 1];
    if (last && distance[last.index] === distance[t.index]) last.label = `${last.label}|${t.label}`;
    else merged.push({ ...t });
  }
  return merged;
}

const W = 760;
const H = 420;
const M = { left: 56, right: 16, top: 16, bottom: 34 };

/** Band structure along a labelled k-path: base dashed slate, proposal solid teal, reference violet dots. */
export function BandPlot({
  distance,
  ticks,
  series,
  title,
  fermiLevel,
}: {
  distance: number[];
  ticks: { index: number; label: string }[];
  series: BandSeries[];
  title: string;
  fermiLevel?: number | null;
}) {
  const [lo, hi] = energyExtent(series.map((s) => s.energies.map((row) => row.filter((v): v is number => v !== null))));
  const x = linearScale([distance[0] ?? 0, distance[distance.length - 1] ?? 1], [M.left, W - M.right]);
  const y = linearScale([lo, hi], [H - M.bottom, M.top]);
  const bandCount = (s: BandSeries) => Math.max(0, ...s.energies.map((r) => r.length));
  return (
    <figure className="rounded-xl border border-rule bg-card p-3">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label={title}>
        <title>{title}</title>
        {niceTicks(lo, hi, 7).map((e) => (
          <g key={e}>
            <line x1={M.left} x2={W - M.right} y1={y(e)} y2={y(e)} stroke="var(--color-rule)" strokeWidth={0.6} />
            <text x={M.left - 6} y={y(e) + 4} textAnchor="end" className="num" fontSize={11} fill="var(--color-ink-soft)">
              {formatEnergy(e)}
            </text>
          </g>
        ))}
        {mergeTicks(distance, ticks).map((t) => (
          <g key={`${t.index}-${t.label}`}>
            <line x1={x(distance[t.index])} x2={x(distance[t.index])} y1={M.top} y2={H - M.bottom} stroke="var(--color-ink-soft)" strokeWidth={0.6} />
            <text x={x(distance[t.index])} y={H - M.bottom + 18} textAnchor="middle" fontSize={13} fill="var(--color-ink)">
              {t.label}
            </text>
          </g>
        ))}
        {fermiLevel !== undefined && fermiLevel !== null ? (
          <g>
            <line x1={M.left} x2={W - M.right} y1={y(fermiLevel)} y2={y(fermiLevel)} stroke="var(--color-copper)" strokeWidth={1} strokeDasharray="2 3" />
            <text x={W - M.right - 4} y={y(fermiLevel) - 4} textAnchor="end" fontSize={11} fill="var(--color-copper-deep)">
              E_F
            </text>
          </g>
        ) : null}
        {series.map((s) =>
          Array.from({ length: bandCount(s) }, (_, band) => {
            const values = s.energies.map((row) => row[band] ?? null);
            if (s.role === "reference") {
              return (
                <g key={`${s.label}-${band}`} fill={STYLE.reference.stroke}>
                  {values.map((v, i) => (v === null ? null : <circle key={i} cx={x((s.distance ?? distance)[i])} cy={y(v)} r={1.8} />))}
                </g>
              );
            }
            return (
              <path
                key={`${s.label}-${band}`}
                d={bandPathData(distance, values, x, y)}
                fill="none"
                stroke={STYLE[s.role].stroke}
                strokeWidth={STYLE[s.role].width}
                strokeDasharray={STYLE[s.role].dash}
              />
            );
          }),
        )}
        <text x={14} y={(H - M.bottom + M.top) / 2} transform={`rotate(-90 14 ${(H - M.bottom + M.top) / 2})`} textAnchor="middle" fontSize={12} fill="var(--color-ink-soft)">
          Energy (eV)
        </text>
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-ink-soft">
        {series.map((s) => (
          <span key={s.label} className="flex items-center gap-1.5">
            <svg width={26} height={8} aria-hidden>
              {s.role === "reference" ? (
                <circle cx={13} cy={4} r={2.5} fill={STYLE.reference.stroke} />
              ) : (
                <line x1={0} x2={26} y1={4} y2={4} stroke={STYLE[s.role].stroke} strokeWidth={2} strokeDasharray={STYLE[s.role].dash} />
              )}
            </svg>
            {s.label}
          </span>
        ))}
      </figcaption>
    </figure>
  );
}
