"use client";

import { useState } from "react";
import { orderedRange, type Range } from "@/lib/review/band-plot-layout";
import { rangeEndLabel, remarkRangeHref } from "@/lib/review/band-range";

const INPUT = "num w-24 rounded border border-rule bg-card px-2 py-1 text-sm";
const BUTTON = "rounded border border-rule bg-card px-2.5 py-1 text-sm hover:bg-paper-deep";

interface Path {
  distance: number[];
  ticks: { index: number; label: string }[];
}

/** Keyboard way to zoom: a leg of the path or typed k and energy ranges; reset; a remark link for the k-range. */
export function BandZoomControls({ path, kRange, eRange, remarkBase, onZoom }: { path: Path; kRange: Range | null; eRange: Range | null; remarkBase: string | null; onZoom: (k: Range | null, e: Range | null) => void }) {
  const fmt = (r: Range | null, i: 0 | 1) => (r ? r[i].toFixed(3) : "");
  const [text, setText] = useState({ k0: fmt(kRange, 0), k1: fmt(kRange, 1), e0: fmt(eRange, 0), e1: fmt(eRange, 1) });
  const [shown, setShown] = useState({ kRange, eRange });
  if (shown.kRange !== kRange || shown.eRange !== eRange) {
    setShown({ kRange, eRange });
    setText({ k0: fmt(kRange, 0), k1: fmt(kRange, 1), e0: fmt(eRange, 0), e1: fmt(eRange, 1) });
  }
  const legs = path.ticks.slice(1).flatMap((t, i) => {
    const from = path.ticks[i];
    const r = orderedRange(path.distance[from.index], path.distance[t.index]);
    return r ? [{ label: `${from.label}–${t.label}`, range: r }] : [];
  });
  const field = (key: keyof typeof text, label: string) => (
    <label className="flex items-center gap-1">
      <span className="text-xs">{label}</span>
      <input type="number" step="0.01" className={INPUT} value={text[key]} onChange={(e) => setText({ ...text, [key]: e.target.value })} />
    </label>
  );
  return (
    <form
      className="flex flex-wrap items-end gap-x-4 gap-y-2 text-sm"
      aria-label="Zoom"
      onSubmit={(e) => {
        e.preventDefault();
        const num = (s: string) => (s.trim() === "" ? NaN : Number(s));
        onZoom(orderedRange(num(text.k0), num(text.k1)), orderedRange(num(text.e0), num(text.e1)));
      }}
    >
      <label className="flex flex-col gap-1">
        <span className="text-xs font-semibold text-ink-soft">Zoom to a leg</span>
        <select
          className="rounded border border-rule bg-card px-2 py-1"
          value=""
          onChange={(e) => {
            const leg = legs[Number(e.target.value)];
            if (leg) onZoom(leg.range, eRange);
          }}
        >
          <option value="">choose…</option>
          {legs.map((l, i) => (
            <option key={i} value={i}>
              {l.label}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="flex items-center gap-2">
        <legend className="mb-1 text-xs font-semibold text-ink-soft">k range (1/Å)</legend>
        {field("k0", "from")}
        {field("k1", "to")}
      </fieldset>
      <fieldset className="flex items-center gap-2">
        <legend className="mb-1 text-xs font-semibold text-ink-soft">Energy range (eV)</legend>
        {field("e0", "from")}
        {field("e1", "to")}
      </fieldset>
      <button type="submit" className={BUTTON}>
        Zoom
      </button>
      <button type="button" className={BUTTON} onClick={() => onZoom(null, null)} disabled={!kRange && !eRange}>
        Reset zoom
      </button>
      {kRange && remarkBase ? (
        <a className="text-copper-deep underline" href={remarkRangeHref(remarkBase, path, kRange)}>
          Remark on this k-range ({rangeEndLabel(path, kRange[0])} to {rangeEndLabel(path, kRange[1])})
        </a>
      ) : null}
    </form>
  );
}
