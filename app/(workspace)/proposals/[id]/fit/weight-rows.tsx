"use client";

import { useRef } from "react";

const cell = "w-20 rounded border border-rule bg-white px-2 py-1 text-right num text-sm focus:border-copper focus:outline-none";

/** Editable rows of weights: per reference band, or per region along the path. */
export function WeightRows<R extends Record<string, string>>({ legend, rows, columns, blank, onChange }: {
  legend: string;
  rows: R[];
  columns: { field: keyof R & string; label: string }[];
  blank: R;
  onChange: (rows: R[]) => void;
}) {
  const box = useRef<HTMLFieldSetElement | null>(null);
  // After adding a row, focus its first field; after removing one, the add button (focus would otherwise fall to the page).
  const focusLater = (selector: string) => requestAnimationFrame(() => box.current?.querySelector<HTMLElement>(selector)?.focus());
  return (
    <fieldset className="mb-4" ref={box}>
      <legend className="mb-1 text-sm font-semibold">{legend}</legend>
      {rows.map((row, i) => (
        <div key={i} className="mb-1 flex items-center gap-2 text-sm">
          {columns.map((c) => (
            <label key={c.field} className="flex items-center gap-1">
              <span className="text-xs text-ink-soft">{c.label}</span>
              <input className={cell} data-row={i} aria-label={`${c.label}, row ${i + 1}`} value={row[c.field]} onChange={(e) => onChange(rows.map((r, j) => (j === i ? { ...r, [c.field]: e.target.value } : r)))} />
            </label>
          ))}
          <button
            type="button"
            className="text-xs text-danger underline"
            aria-label={`remove row ${i + 1}`}
            onClick={() => {
              onChange(rows.filter((_, j) => j !== i));
              focusLater("button[data-add]");
            }}
          >
            remove
          </button>
        </div>
      ))}
      <button
        type="button"
        data-add
        className="text-xs text-copper-deep underline"
        onClick={() => {
          onChange([...rows, { ...blank }]);
          focusLater(`input[data-row="${rows.length}"]`);
        }}
      >
        + add a row
      </button>
    </fieldset>
  );
}
