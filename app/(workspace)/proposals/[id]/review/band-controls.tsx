"use client";

import { ALIGNMENT_LABEL, type Alignment } from "@/lib/review/alignment";
import type { DeltaMode } from "./plot-delta";

const INPUT = "num w-24 rounded border border-rule bg-card px-2 py-1 text-sm";

export interface BandControlsState {
  alignment: Alignment;
  windowText: [string, string];
  hidden: string[];
  deltaMode: DeltaMode;
}

/** Alignment, energy window, reference toggles and the ΔE display: every control labelled and keyboard usable. */
export function BandControls({
  state,
  references,
  onChange,
}: {
  state: BandControlsState;
  references: { id: string; name: string }[];
  onChange: (next: Partial<BandControlsState>) => void;
}) {
  return (
    <div className="flex flex-wrap items-end gap-x-6 gap-y-3 text-sm">
      <label className="flex flex-col gap-1">
        <span className="text-xs font-semibold text-ink-soft">Alignment</span>
        <select className="rounded border border-rule bg-card px-2 py-1" value={state.alignment} onChange={(e) => onChange({ alignment: e.target.value as Alignment })}>
          {(Object.keys(ALIGNMENT_LABEL) as Alignment[]).map((a) => (
            <option key={a} value={a}>
              {ALIGNMENT_LABEL[a]}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="flex items-end gap-2">
        <legend className="mb-1 text-xs font-semibold text-ink-soft">Energy window (eV)</legend>
        {(["from", "to"] as const).map((end, i) => (
          <label key={end} className="flex items-center gap-1">
            <span className="text-xs">{end}</span>
            <input
              type="number"
              step="0.1"
              inputMode="decimal"
              className={INPUT}
              aria-label={`Energy window ${end} (eV)`}
              value={state.windowText[i]}
              onChange={(e) => onChange({ windowText: (i === 0 ? [e.target.value, state.windowText[1]] : [state.windowText[0], e.target.value]) as [string, string] })}
            />
          </label>
        ))}
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-xs font-semibold text-ink-soft">ΔE panel</legend>
        <div className="flex gap-3">
          {(["max", "per-band"] as const).map((m) => (
            <label key={m} className="flex items-center gap-1">
              <input type="radio" name="delta-mode" checked={state.deltaMode === m} onChange={() => onChange({ deltaMode: m })} />
              {m === "max" ? "max |ΔE|" : "per band"}
            </label>
          ))}
        </div>
      </fieldset>
      {references.length > 0 ? (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-xs font-semibold text-ink-soft">Reference bands</legend>
          <div className="flex flex-wrap gap-3">
            {references.map((r) => (
              <label key={r.id} className="flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={!state.hidden.includes(r.id)}
                  onChange={(e) => onChange({ hidden: e.target.checked ? state.hidden.filter((h) => h !== r.id) : [...state.hidden, r.id] })}
                />
                {r.name}
              </label>
            ))}
          </div>
        </fieldset>
      ) : null}
    </div>
  );
}
