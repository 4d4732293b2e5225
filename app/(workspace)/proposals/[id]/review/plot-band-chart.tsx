"use client";

import { useState, type PointerEvent, type Ref } from "react";
import { bandPathData, formatEnergy, niceTicks } from "@/lib/plot/scale";
import type { BandViewData } from "@/lib/review/band-view";
import { CHART, invert, orderedRange, type ChartScales, type Range } from "@/lib/review/band-plot-layout";
import { PlotDelta, type DeltaMode } from "./plot-delta";
import { PlotDos } from "./plot-dos";

const B = CHART.bands;
const MIN_DRAG = 6;

export interface BandChartProps {
  view: BandViewData;
  baseShift: number;
  scales: ChartScales;
  window: Range | null;
  delta: { perK: number[]; perBandK: number[][] };
  deltaMode: DeltaMode;
  title: string;
  description: string;
  svgRef: Ref<SVGSVGElement>;
  onSelect: (k: Range, e: Range | null) => void;
}

/** Two labels at one distance (a jump in the path, e.g. U and K) share one mark: "U|K". */
function mergedTicks(distance: number[], ticks: { index: number; label: string }[]) {
  const out: { d: number; label: string }[] = [];
  for (const t of ticks) {
    const last = out[out.length - 1];
    if (last && last.d === distance[t.index]) last.label = `${last.label}|${t.label}`;
    else out.push({ d: distance[t.index], label: t.label });
  }
  return out;
}

function bandLines(rows: number[][] | null, distance: number[], s: ChartScales, stroke: string, width: number, dash?: string) {
  if (!rows || rows.length === 0) return null;
  return Array.from({ length: rows[0].length }, (_, n) => (
    <path key={n} d={bandPathData(distance, rows.map((r) => r[n] ?? null), s.x, s.y)} fill="none" stroke={stroke} strokeWidth={width} strokeDasharray={dash} />
  ));
}

export function BandChart({ svgRef, ...props }: BandChartProps) {
  const { view, scales: s, window } = props;
  const [drag, setDrag] = useState<{ x0: number; y0: number; x1: number; y1: number } | null>(null);
  const [k0, k1] = s.x.domain;
  const [e0, e1] = s.y.domain;
  const ticks = mergedTicks(view.path.distance, view.path.ticks).filter((t) => t.d >= k0 - 1e-9 && t.d <= k1 + 1e-9);
  const toChart = (ev: PointerEvent<SVGRectElement>) => {
    const box = ev.currentTarget.ownerSVGElement?.getBoundingClientRect();
    if (!box) return { x: 0, y: 0 };
    return { x: ((ev.clientX - box.left) / box.width) * CHART.width, y: ((ev.clientY - box.top) / box.height) * CHART.height };
  };
  const finish = () => {
    if (!drag) return;
    const k = orderedRange(invert(s.x, drag.x0), invert(s.x, drag.x1));
    const e = Math.abs(drag.y1 - drag.y0) >= MIN_DRAG ? orderedRange(invert(s.y, drag.y0), invert(s.y, drag.y1)) : null;
    setDrag(null);
    if (k && Math.abs(drag.x1 - drag.x0) >= MIN_DRAG) props.onSelect(k, e);
  };
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
  return (
    <svg ref={svgRef} viewBox={`0 0 ${CHART.width} ${CHART.height}`} className="h-auto w-full select-none" role="img" aria-labelledby="band-chart-title band-chart-desc">
      <title id="band-chart-title">{props.title}</title>
      <desc id="band-chart-desc">{props.description}</desc>
      <defs>
        <clipPath id="band-area">
          <rect x={B.left} y={B.top} width={B.right - B.left} height={B.bottom - B.top} />
        </clipPath>
      </defs>
      <rect x={B.left} y={B.top} width={B.right - B.left} height={B.bottom - B.top} fill="var(--color-card)" stroke="var(--color-rule)" />
      {window ? (
        <g clipPath="url(#band-area)">
          <rect x={B.left} width={B.right - B.left} y={s.y(window[1])} height={Math.max(0, s.y(window[0]) - s.y(window[1]))} fill="var(--color-copper-pale)" opacity={0.55} />
          <text x={B.right - 6} y={clamp(s.y(window[1]) + 13, B.top + 12, B.bottom - 4)} textAnchor="end" fontSize={11} fill="var(--color-copper-deep)">
            window
          </text>
        </g>
      ) : null}
      {niceTicks(e0, e1, 7).map((e) => (
        <g key={e}>
          <line x1={B.left} x2={B.right} y1={s.y(e)} y2={s.y(e)} stroke="var(--color-rule)" strokeWidth={0.6} />
          <text x={B.left - 6} y={s.y(e) + 4} textAnchor="end" className="num" fontSize={11} fill="var(--color-ink-soft)">
            {formatEnergy(e)}
          </text>
        </g>
      ))}
      {ticks.map((t) => (
        <g key={`${t.d}-${t.label}`}>
          <line x1={s.x(t.d)} x2={s.x(t.d)} y1={B.top} y2={CHART.delta.bottom} stroke="var(--color-ink-soft)" strokeWidth={0.6} />
          <text x={s.x(t.d)} y={CHART.tickLabelY} textAnchor="middle" fontSize={13} fill="var(--color-ink)">
            {t.label}
          </text>
        </g>
      ))}
      <g clipPath="url(#band-area)">
        {view.proposedFermi !== null ? (
          <line x1={B.left} x2={B.right} y1={s.y(view.proposedFermi)} y2={s.y(view.proposedFermi)} stroke="var(--color-copper)" strokeWidth={1} strokeDasharray="2 3" />
        ) : null}
        {bandLines(view.base, view.path.distance, s, "var(--color-slate-line)", 1.4, "5 4")}
        {bandLines(view.proposed, view.path.distance, s, "var(--color-teal-line)", 1.8)}
        {view.references.map((r) => (
          <g key={r.id} fill="var(--color-violet-dot)">
            {r.energies.flatMap((row, i) =>
              r.distance[i] < k0 - 1e-9 || r.distance[i] > k1 + 1e-9
                ? []
                : row.map((e, n) => (e === null ? null : <circle key={`${i}-${n}`} cx={s.x(r.distance[i])} cy={s.y(e)} r={1.9} />)),
            )}
          </g>
        ))}
      </g>
      {view.proposedFermi !== null && view.proposedFermi >= e0 && view.proposedFermi <= e1 ? (
        <text x={B.right - 4} y={s.y(view.proposedFermi) - 4} textAnchor="end" fontSize={11} fill="var(--color-copper-deep)">
          E_F
        </text>
      ) : null}
      <text x={16} y={(B.top + B.bottom) / 2} transform={`rotate(-90 16 ${(B.top + B.bottom) / 2})`} textAnchor="middle" fontSize={12} fill="var(--color-ink-soft)">
        Energy (eV)
      </text>
      <PlotDelta distance={view.path.distance} delta={props.delta} mode={props.deltaMode} x={s.x} hasBase={view.base !== null} />
      <PlotDos dos={view.dos} baseShift={props.baseShift} y={s.y} />
      {drag ? (
        <rect
          x={Math.min(drag.x0, drag.x1)}
          width={Math.abs(drag.x1 - drag.x0)}
          y={Math.abs(drag.y1 - drag.y0) >= MIN_DRAG ? Math.min(drag.y0, drag.y1) : B.top}
          height={Math.abs(drag.y1 - drag.y0) >= MIN_DRAG ? Math.abs(drag.y1 - drag.y0) : B.bottom - B.top}
          fill="var(--color-copper)"
          opacity={0.15}
          stroke="var(--color-copper)"
        />
      ) : null}
      <rect
        x={B.left}
        y={B.top}
        width={B.right - B.left}
        height={B.bottom - B.top}
        fill="transparent"
        className="cursor-crosshair"
        data-testid="band-drag-area"
        onPointerDown={(ev) => {
          ev.currentTarget.setPointerCapture(ev.pointerId);
          const p = toChart(ev);
          setDrag({ x0: p.x, y0: p.y, x1: p.x, y1: p.y });
        }}
        onPointerMove={(ev) => {
          if (!drag) return;
          const p = toChart(ev);
          setDrag({ ...drag, x1: clamp(p.x, B.left, B.right), y1: clamp(p.y, B.top, B.bottom) });
        }}
        onPointerUp={finish}
        onPointerCancel={() => setDrag(null)}
      />
    </svg>
  );
}
