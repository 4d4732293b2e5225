import { energyExtent, linearScale, niceTicks } from "@/lib/plot/scale";
import type { FitPreview } from "@/lib/fits/preview";

const W = 640;
const H = 360;
const M = { left: 52, right: 12, top: 12, bottom: 30 };

/**
 * Which reference values enter the fit: filled copper dots (darker = more weight), hollow grey dots for values left
 * out, the model's bands at the start values as lines, and the window as dashed lines.
 */
export function FitPreviewPlot({ plot, window }: { plot: FitPreview["plot"]; window: [number, number] | null }) {
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
        <circle key={`i${i}`} cx={x(d)} cy={y(e)} r={2} fill="var(--color-copper-deep)" fillOpacity={0.25 + 0.75 * (w / maxW)} />
      ))}
      <text x={12} y={M.top + 4} fontSize={11} fill="var(--color-ink-soft)" transform={`rotate(-90 12 ${M.top + 4})`} textAnchor="end">
        E (eV)
      </text>
      <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle" fontSize={11} fill="var(--color-ink-soft)">
        position along the default path (1/Å)
      </text>
    </svg>
  );
}
