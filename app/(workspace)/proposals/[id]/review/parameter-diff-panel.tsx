"use client";

import { useState } from "react";
import type { ParameterDiff, StructuralChange } from "@/lib/review/param-diff";
import { groupParamRows, type ParamSortKey } from "@/lib/review/param-diff-sort";
import { formatFixed } from "./diff-format";
import { HeatLegend, ParamDiffRowView } from "./diff-param-row";

const STRUCTURE_GLYPH: Record<StructuralChange["kind"], string> = {
  "orbital-added": "+", "shell-added": "+", "site-added": "+", "hopping-added": "+",
  "orbital-removed": "−", "shell-removed": "−", "site-removed": "−", "hopping-removed": "−",
  "lattice-changed": "↔", "electron-count-changed": "↔",
};

const SORTS: { key: ParamSortKey; label: string; column: number }[] = [
  { key: "key", label: "Parameter", column: 0 },
  { key: "percent", label: "%Δ", column: 4 },
  { key: "effect", label: "Effect |ΔE| (eV)", column: 5 },
];

function remarkHrefFor(remarkBase: string, key: string): string {
  return `${remarkBase}?remark=param:${encodeURIComponent(key)}#remarks`;
}

/** The keyed parameter diff: structure changes, the gauge verdict, and the table of changed parameters. */
export function ParameterDiffPanel({ diff, remarkBase }: { diff: ParameterDiff; remarkBase: string | null }) {
  const [sort, setSort] = useState<ParamSortKey>("effect");
  const groups = groupParamRows(diff.rows, sort);
  const windowText = diff.window ? `[${formatFixed(diff.window[0], 2)}, ${formatFixed(diff.window[1], 2)}] eV` : "every band";
  const header = (label: string, column: number) => {
    const s = SORTS.find((x) => x.column === column);
    const align = column === 0 ? "text-left" : "text-right";
    if (!s) return <th key={column} scope="col" className={`px-3 py-1.5 ${align} font-semibold`}>{label}</th>;
    const active = sort === s.key;
    return (
      <th key={column} scope="col" aria-sort={active ? (s.key === "key" ? "ascending" : "descending") : "none"} className={`px-3 py-1.5 ${align} font-semibold`}>
        <button type="button" onClick={() => setSort(s.key)} className={`rounded px-1 ${active ? "text-copper-deep underline" : "hover:underline"}`}>
          {s.label}
          <span aria-hidden="true" className="ml-1 text-xs">{active ? (s.key === "key" ? "▴" : "▾") : "↕"}</span>
        </button>
      </th>
    );
  };
  return (
    <div className="space-y-3" data-testid="parameter-diff">
      {diff.gauge.verdict === "no physical change" ? (
        <div role="note" className="rounded-md border border-copper bg-copper-pale px-3 py-2 text-sm">
          <span className="font-semibold"><span aria-hidden="true">◇ </span>No physical change:</span> {diff.gauge.explanation}. Together these changes leave every
          band in place; any one of them alone would move the bands by its effect.
        </div>
      ) : null}
      {diff.structural.length ? (
        <div>
          <h3 className="mb-1 text-sm font-semibold">Structure</h3>
          <ul className="rounded-lg border border-rule bg-card text-sm">
            {diff.structural.map((c, i) => (
              <li key={i} className="flex gap-2 border-b border-rule px-3 py-1 last:border-b-0">
                <span aria-hidden="true" className="num w-4 text-center text-ink-soft">{STRUCTURE_GLYPH[c.kind]}</span>
                <span>{c.text}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {diff.rows.length === 0 ? (
        <p className="text-sm text-ink-soft">{diff.gauge.verdict === "identical" ? "No parameter changed." : "No parameter value changed."}</p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule bg-card">
          <table className="w-full text-sm">
            <caption className="px-3 py-2 text-left text-xs text-ink-soft">
              {diff.rows.length} changed parameter{diff.rows.length === 1 ? "" : "s"}. Effect: the largest band shift |ΔE| the change causes on its
              own along the base path, bands within {windowText}; ≈ marks a first-order estimate (Hellmann–Feynman), the rest are exact recomputes.
            </caption>
            <thead className="bg-paper-deep">
              <tr>{["Parameter", "Base (eV)", "Proposed (eV)", "Δ (eV)", "%Δ", "Effect"].map((label, i) => header(label, i))}</tr>
            </thead>
            {groups.map((g) => (
              <tbody key={g.group} className="divide-y divide-rule border-t border-rule">
                <tr className="bg-paper">
                  <th scope="colgroup" colSpan={6} className="px-3 py-1 text-left text-xs font-semibold uppercase tracking-wider text-ink-soft">
                    {g.group}
                  </th>
                </tr>
                {g.rows.map((row) => (
                  <ParamDiffRowView key={row.key} row={row} remarkHref={remarkBase === null ? null : remarkHrefFor(remarkBase, row.key)} />
                ))}
              </tbody>
            ))}
          </table>
        </div>
      )}
      {diff.rows.length ? <HeatLegend /> : null}
    </div>
  );
}
