import { energyExtent, linearScale, niceTicks } from "@/lib/plot/scale";
import type { FitPreview } from "@/lib/fits/preview";

const W = 640;
const H = 360;
const M = { left: 52, right: 12, top: 12, bottom: 34 };

/**
 * Which reference values enter the fit: filled violet dots (darker = more weight), hollow grey dots for values left
 * out, the model's bands at the start values as dashed lines, the window as copper dashed lines, weighted regions
 * shaded, and the path's high-symmetry points on the axis.
 */
export function FitPreviewPlot({ plot, window, regions }: { plot: FitPreview["plot"]; window: [number, number] | null; regions: { from: number; to: number; weight: number }[] }) {
  const energies = [...plot.included.map((p) => p[1]), ...plot.excluded.map((p) => p[1])];
  const [lo, hi] = energyExtent([[energies], plot.model]);
  const d0 = Math.min(...plot.distance);
  const d1 = Math.max(...plot.distance);
  const x = linearScale([d0, d1 > d0 ? d1 : d0 + 1], [M.left, W - M.right]);
  const y = linearScale([lo, hi], [H - M.bottom, M.top]);
  const maxW = Math.max(1e-12, ...plot.included.map((p) => p[2]));
  const bands = Math.max(0, ...plot.model.map((r) => r.length));
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label="Preview of the reference values that enter the fit">
      <title>Reference values in the fit (filled) and left out (hollow), with the model bands at the start values</title>
      {niceTicks(lo, hi, 6).map((e) => (
        <g key={e}>
          <line x1={M.left} x2={W - M.right} y1={y(e)} y2={y(e)} stroke="var(--color-rule)" strokeWidth={0.6} />
          <text x={M.left - 6} y={y(e) + 4} textAnchor="end" fontSize={11} className="num" fill="var(--color-ink-soft)">
            {e}
          </text>
        </g>
      ))}
      {regions.map((r, i) => (
        <rect key={`r${i}`} x={x(Math.max(r.from, d0))} width={Math.max(0, x(Math.min(r.to, d1)) - x(Math.max(r.from, d0)))} y={M.top} height={H - M.bottom - M.top} fill="var(--color-copper-pale)" fillOpacity={0.6} />
      ))}
      {plot.ticks.map((t, i) => (
        <g key={`t${i}`}>
          <line x1={x(t.distance)} x2={x(t.distance)} y1={M.top} y2={H - M.bottom} stroke="var(--color-rule)" strokeWidth={0.8} />
          <text x={x(t.distance)} y={H - M.bottom + 14} textAnchor="middle" fontSize={12} fill="var(--color-ink)">
            {t.label}
          </text>
        </g>
      ))}
      {Array.from({ length: bands }, (_, b) => (
        <polyline
          key={b}
          points={plot.model.map((row, k) => (row[b] === undefined ? "" : `${x(plot.distance[k]).toFixed(1)},${y(row[b]).toFixed(1)}`)).join(" ")}
          fill="none"
          stroke="var(--color-slate-line)"
          strokeWidth={1}
          strokeDasharray="4 3"
        />
      ))}
      {window
        ? window.map((e) => <line key={e} x1={M.left} x2={W - M.right} y1={y(e)} y2={y(e)} stroke="var(--color-copper)" strokeDasharray="6 4" strokeWidth={1.2} />)
        : null}
      {plot.excluded.map(([d, e], i) => (
        <circle key={`x${i}`} cx={x(d)} cy={y(e)} r={1.8} fill="none" stroke="var(--color-ink-soft)" strokeOpacity={0.45} strokeWidth={0.7} />
      ))}
      {plot.included.map(([d, e, w], i) => (
        <circle key={`i${i}`} cx={x(d)} cy={y(e)} r={2} fill="var(--color-violet-dot)" fillOpacity={0.35 + 0.65 * (w / maxW)} />
      ))}
      <text x={12} y={M.top + 4} fontSize={11} fill="var(--color-ink-soft)" transform={`rotate(-90 12 ${M.top + 4})`} textAnchor="end">
        E (eV)
      </text>
      <text x={W - M.right} y={H - 4} textAnchor="end" fontSize={10} fill="var(--color-ink-soft)">
        {`path position, 1/Å: ${d0.toFixed(2)} … ${d1.toFixed(2)}`}
      </text>
    </svg>
  );
}
