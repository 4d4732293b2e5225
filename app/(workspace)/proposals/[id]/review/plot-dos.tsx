import { linearScale, type LinearScale } from "@/lib/plot/scale";
import { CHART } from "@/lib/review/band-plot-layout";

const B = CHART.bands;
const P = CHART.dos;

function dosPath(energy: number[], dos: number[], shift: number, x: LinearScale, y: LinearScale, lo: number, hi: number): string {
  let d = "";
  energy.forEach((e, i) => {
    const at = e + shift;
    if (at < lo || at > hi) return;
    d += `${d ? "L" : "M"}${x(dos[i]).toFixed(1)} ${y(at).toFixed(1)}`;
  });
  return d;
}

/** DOS beside the bands on their energy axis: base dashed slate (moved with the base alignment), proposed solid teal. */
export function PlotDos({ dos, baseShift, y }: { dos: { energy: number[]; base: number[] | null; proposed: number[] }; baseShift: number; y: LinearScale }) {
  const [lo, hi] = y.domain;
  const visible = (values: number[] | null, shift: number) => (values ?? []).filter((_, i) => dos.energy[i] + shift >= lo && dos.energy[i] + shift <= hi);
  const top = Math.max(1e-6, ...visible(dos.proposed, 0), ...visible(dos.base, baseShift));
  const x = linearScale([0, top * 1.05], [P.left, P.right]);
  return (
    <g>
      <rect x={P.left} y={B.top} width={P.right - P.left} height={B.bottom - B.top} fill="var(--color-card)" stroke="var(--color-rule)" />
      {dos.base ? <path d={dosPath(dos.energy, dos.base, baseShift, x, y, lo, hi)} fill="none" stroke="var(--color-slate-line)" strokeWidth={1.2} strokeDasharray="5 4" /> : null}
      <path d={dosPath(dos.energy, dos.proposed, 0, x, y, lo, hi)} fill="none" stroke="var(--color-teal-line)" strokeWidth={1.5} />
      <text x={(P.left + P.right) / 2} y={B.bottom + 16} textAnchor="middle" fontSize={11} fill="var(--color-ink-soft)">
        DOS (states/eV/cell)
      </text>
      <text x={P.right} y={B.bottom + 30} textAnchor="end" className="num" fontSize={10} fill="var(--color-ink-soft)">
        max {top.toFixed(2)}
      </text>
    </g>
  );
}
