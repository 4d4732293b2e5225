"use client";

import { useEffect, useMemo, useRef, useState } from "react";
import { alignedView, deltaE, type Alignment } from "@/lib/review/alignment";
import { chartScales, CHART, orderedRange, type Range } from "@/lib/review/band-plot-layout";
import { nearestPathIndex } from "@/lib/review/band-range";
import type { BandViewData } from "@/lib/review/band-view";
import { buildBandCsv } from "@/lib/review/export-csv";
import { BandControls, type BandControlsState } from "./band-controls";
import { BandExportButtons } from "./band-export-buttons";
import { BandKeyPoints } from "./band-key-points";
import { BandZoomControls } from "./band-zoom-controls";
import { BandChart } from "./plot-band-chart";

const SNAP_TO_TICK = 0.012;

/** Drag ends snap to a tick when close to one, else to the nearest path point, so links name ticks where meant. */
function snapRange(range: Range, path: BandViewData["path"]): Range {
  const span = Math.abs(range[1] - range[0]) || 1;
  const total = (path.distance[path.distance.length - 1] ?? 1) - (path.distance[0] ?? 0);
  const snap = (d: number) => {
    const tick = path.ticks.map((t) => path.distance[t.index]).find((td) => Math.abs(td - d) <= SNAP_TO_TICK * Math.max(span, total * 0.25));
    return tick ?? path.distance[nearestPathIndex(path.distance, d)];
  };
  return orderedRange(snap(range[0]), snap(range[1])) ?? range;
}

function parseWindow([a, b]: [string, string]): Range | null {
  if (a.trim() === "" || b.trim() === "") return null;
  return orderedRange(Number(a), Number(b));
}

/** Band comparison: base, proposed and reference bands with ΔE(k) beneath and the DOS beside; align, window, zoom, export. */
export function BandPanel({
  data,
  remarkBase,
  initialWindow,
  initialAlignment,
  slug = "proposal",
  onSettingsChange,
}: {
  data: BandViewData;
  remarkBase: string | null;
  initialWindow: [number, number] | null;
  /** Default: the valence-band maximum when the proposed revision has one, else none. */
  initialAlignment?: Alignment;
  /** File stem of the exports (see proposalSlug). */
  slug?: string;
  /** Told when the alignment or a valid energy window changes (the metrics table follows them). */
  onSettingsChange?: (settings: { alignment: Alignment; window: Range | null }) => void;
}) {
  const [controls, setControls] = useState<BandControlsState>({
    alignment: initialAlignment ?? (data.proposedVbm === null ? "none" : "vbm"),
    windowText: initialWindow ? [String(initialWindow[0]), String(initialWindow[1])] : ["", ""],
    hidden: [],
    deltaMode: "max",
  });
  const [zoom, setZoom] = useState<{ k: Range | null; e: Range | null }>({ k: null, e: null });
  const [message, setMessage] = useState<string | null>(null);
  const svgRef = useRef<SVGSVGElement | null>(null);
  const energyWindow = useMemo(() => parseWindow(controls.windowText), [controls.windowText]);
  const windowKey = energyWindow ? energyWindow.join(",") : "";
  useEffect(() => {
    onSettingsChange?.({ alignment: controls.alignment, window: windowKey ? (windowKey.split(",").map(Number) as Range) : null });
  }, [controls.alignment, windowKey, onSettingsChange]);

  const shown = useMemo(() => {
    const visible = { ...data, references: data.references.filter((r) => !controls.hidden.includes(r.id)) };
    return alignedView(visible, controls.alignment, energyWindow);
  }, [data, controls.alignment, controls.hidden, energyWindow]);
  const delta = useMemo(() => deltaE(shown, energyWindow), [shown, energyWindow]);
  const scales = chartScales(shown.path.distance, zoom.k, zoom.e, [shown.proposed, shown.base ?? [], ...shown.references.map((r) => r.energies)]);

  const title = `Band structure along ${data.path.ticks.map((t) => t.label).join("–")}: ${data.base ? "base release (dashed), " : ""}proposed revision (solid)${shown.references.length ? `, ${shown.references.length} reference set(s) (dots)` : ""}`;
  const description = `ΔE(k) = proposed − base beneath on the same k axis; density of states beside. ${shown.shiftNote}`;

  return (
    <section aria-label="Band comparison" className="rounded-xl border border-rule bg-card p-4">
      <BandControls state={controls} references={data.references.map((r) => ({ id: r.id, name: r.name }))} onChange={(next) => setControls({ ...controls, ...next })} />
      <p className="mt-3 text-xs text-ink-soft" aria-live="polite" data-testid="band-shift-note">
        {shown.shiftNote}
        {controls.windowText.some((t) => t.trim() !== "") && !energyWindow ? " The energy window needs two different numbers." : ""}
      </p>
      <div className="mt-3" style={{ aspectRatio: `${CHART.width} / ${CHART.height}` }}>
        <BandChart
          view={shown}
          baseShift={shown.baseShift}
          scales={scales}
          window={energyWindow}
          delta={delta}
          deltaMode={controls.deltaMode}
          title={title}
          description={description}
          svgRef={svgRef}
          onSelect={(k, e) => setZoom({ k: snapRange(k, data.path), e })}
        />
      </div>
      <ul className="mt-1 flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-soft" aria-label="Legend">
        {data.base ? <li>┄ slate dashed: base release</li> : null}
        <li>— teal solid: proposed revision</li>
        {shown.references.map((r) => (
          <li key={r.id}>• violet dots: {r.name}</li>
        ))}
        <li>┈ copper dotted: Fermi level of the proposed revision</li>
        <li>Drag across the bands to zoom; or use the fields below.</li>
      </ul>
      <div className="mt-4 space-y-3 border-t border-rule pt-3">
        <BandZoomControls path={data.path} kRange={zoom.k} eRange={zoom.e} remarkBase={remarkBase} onZoom={(k, e) => setZoom({ k, e })} />
        <BandExportButtons
          slug={slug}
          svgRef={svgRef}
          csv={() => buildBandCsv(shown, { range: zoom.k })}
          onError={setMessage}
        />
        {message ? (
          <p role="alert" className="text-sm text-danger">
            Export failed: {message}
          </p>
        ) : null}
      </div>
      <BandKeyPoints view={shown} delta={delta} />
    </section>
  );
}
