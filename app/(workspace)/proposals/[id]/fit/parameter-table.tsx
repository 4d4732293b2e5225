"use client";

import type { FitParameterRow } from "@/lib/fits/form";

const cell = "w-24 rounded border border-rule bg-white px-2 py-1 text-right num text-sm focus:border-copper focus:outline-none";

/** Which parameters are free, with optional bounds; the rest stay at the revision's values. */
export function ParameterTable({ rows, onChange }: { rows: FitParameterRow[]; onChange: (rows: FitParameterRow[]) => void }) {
  const set = (i: number, patch: Partial<FitParameterRow>) => onChange(rows.map((r, j) => (j === i ? { ...r, ...patch } : r)));
  const setKind = (prefix: string, free: boolean) => onChange(rows.map((r) => (r.key.startsWith(prefix) ? { ...r, free } : r)));
  return (
    <div>
      <div className="mb-2 flex flex-wrap gap-2 text-xs">
        <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-paper-deep" onClick={() => setKind("shell/", true)}>
          Free every two-centre integral
        </button>
        <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-paper-deep" onClick={() => setKind("onsite/", true)}>
          Free every on-site energy
        </button>
        <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-paper-deep" onClick={() => onChange(rows.map((r) => ({ ...r, free: false })))}>
          Fix all
        </button>
      </div>
      <div className="max-h-96 overflow-auto rounded border border-rule">
        <table className="w-full text-sm">
          <caption className="sr-only">Parameters: free or fixed, with bounds</caption>
          <thead className="sticky top-0 bg-paper-deep text-left text-xs text-ink-soft">
            <tr>
              <th className="px-2 py-1">Free</th>
              <th>Parameter</th>
              <th className="text-right">Start (eV)</th>
              <th className="text-right">Lower</th>
              <th className="pr-2 text-right">Upper</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={r.key} className={`border-t border-rule ${r.free ? "bg-copper-pale/40" : ""}`}>
                <td className="px-2 py-1">
                  <input type="checkbox" checked={r.free} onChange={(e) => set(i, { free: e.target.checked })} aria-label={`fit ${r.label}`} />
                </td>
                <td>
                  {r.label} <span className="block text-xs text-ink-soft">{r.key}</span>
                </td>
                <td className="num text-right">{Number(r.value.toPrecision(6))}</td>
                <td className="text-right">
                  <input className={cell} value={r.lower} disabled={!r.free} onChange={(e) => set(i, { lower: e.target.value })} aria-label={`lower bound of ${r.label}`} placeholder="none" />
                </td>
                <td className="pr-2 text-right">
                  <input className={cell} value={r.upper} disabled={!r.free} onChange={(e) => set(i, { upper: e.target.value })} aria-label={`upper bound of ${r.label}`} placeholder="none" />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
