"use client";

import { useMemo, useState } from "react";
import { collapseUnchanged, diffCanonicalText, sideBySide, type Collapsed, type TextDiffLine } from "@/lib/review/text-diff";
import { DiffLineCells, ShowUnchanged } from "./diff-text-cells";

type Mode = "unified" | "split";

/** The canonical serialisation of both sides, line by line: unified or side by side, unchanged runs folded. */
export function TextDiffPanel({ before, after, beforeLabel, afterLabel }: { before: string; after: string; beforeLabel: string; afterLabel: string }) {
  const [mode, setMode] = useState<Mode>("unified");
  const [opened, setOpened] = useState<Set<string>>(() => new Set());
  const lines = useMemo(() => diffCanonicalText(before, after), [before, after]);
  const pairs = useMemo(() => sideBySide(lines), [lines]);
  const removed = lines.filter((l) => l.kind === "removed").length;
  const added = lines.filter((l) => l.kind === "added").length;
  const open = (id: string) => setOpened((s) => new Set(s).add(id));
  const folded = <T,>(rows: T[], isSame: (r: T) => boolean, render: (r: T, i: number) => React.ReactElement, columns: number) =>
    collapseUnchanged(rows, isSame).flatMap((part: Collapsed<T>) => {
      const id = `${mode}:${part.start}`;
      if (part.kind === "rows") return part.rows.map((r, i) => render(r, part.start + i));
      if (opened.has(id)) return rows.slice(part.start, part.start + part.count).map((r, i) => render(r, part.start + i));
      return [<ShowUnchanged key={id} count={part.count} columns={columns} onShow={() => open(id)} />];
    });
  const toggle = (m: Mode, label: string) => (
    <button type="button" aria-pressed={mode === m} onClick={() => setMode(m)}
      className={`px-3 py-1 text-sm ${mode === m ? "bg-ink text-paper" : "bg-card hover:bg-paper-deep"}`}>
      {label}
    </button>
  );
  return (
    <div className="space-y-2" data-testid="text-diff">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm">
          <span className="font-semibold">{beforeLabel}</span> → <span className="font-semibold">{afterLabel}</span>
          <span className="num ml-2 text-xs text-ink-soft">−{removed} / +{added} lines</span>
        </p>
        <div role="group" aria-label="Layout" className="inline-flex overflow-hidden rounded-md border border-rule">
          {toggle("unified", "Unified")}
          {toggle("split", "Side by side")}
        </div>
      </div>
      {removed + added === 0 ? <p className="text-sm text-ink-soft">The canonical texts are identical.</p> : null}
      <div className="overflow-x-auto rounded-lg border border-rule bg-card">
        <table className="w-full table-fixed border-collapse text-xs">
          <caption className="sr-only">{`Canonical text of ${beforeLabel} against ${afterLabel}`}</caption>
          {mode === "unified" ? (
            <>
              <colgroup><col className="w-12" /><col className="w-12" /><col className="w-6" /><col /></colgroup>
              <tbody>
                {folded(lines, (l: TextDiffLine) => l.kind === "same", (l, i) => (
                  <tr key={i}><DiffLineCells line={l} numbers={[l.oldNo, l.newNo]} /></tr>
                ), 4)}
              </tbody>
            </>
          ) : (
            <>
              <colgroup><col className="w-12" /><col className="w-6" /><col /><col className="w-12" /><col className="w-6" /><col /></colgroup>
              <tbody>
                {folded(pairs, (p) => p.left?.kind === "same", (p, i) => (
                  <tr key={i}>
                    <DiffLineCells line={p.left} numbers={[p.left?.oldNo ?? null]} />
                    <DiffLineCells line={p.right} numbers={[p.right?.newNo ?? null]} divider />
                  </tr>
                ), 6)}
              </tbody>
            </>
          )}
        </table>
      </div>
    </div>
  );
}
