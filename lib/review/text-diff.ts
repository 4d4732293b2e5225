import { diffArrays } from "diff";

export interface TextDiffLine {
  kind: "same" | "added" | "removed";
  oldNo: number | null;
  newNo: number | null;
  text: string;
}

export interface SideBySideRow {
  left: TextDiffLine | null;
  right: TextDiffLine | null;
}

const linesOf = (text: string) => (text === "" ? [] : text.replace(/\n$/, "").split("\n"));

/**
 * Line diff of two texts (the canonical pretty serialisation of two documents), 1-based line numbers on each side.
 * The diff runs on whole lines as array items, so a last line without a newline compares equal to the same line
 * followed by more text; a replaced run lists its removed lines before its added lines.
 */
export function diffCanonicalText(before: string, after: string): TextDiffLine[] {
  const out: TextDiffLine[] = [];
  let oldNo = 1, newNo = 1;
  for (const part of diffArrays(linesOf(before), linesOf(after))) {
    for (const text of part.value) {
      if (part.removed) out.push({ kind: "removed", oldNo: oldNo++, newNo: null, text });
      else if (part.added) out.push({ kind: "added", oldNo: null, newNo: newNo++, text });
      else out.push({ kind: "same", oldNo: oldNo++, newNo: newNo++, text });
    }
  }
  return out;
}

/** Pairs a run of removed lines with the added lines that follow it, row by row; unchanged lines face themselves. */
export function sideBySide(lines: TextDiffLine[]): SideBySideRow[] {
  const rows: SideBySideRow[] = [];
  for (let i = 0; i < lines.length; ) {
    if (lines[i].kind === "same") {
      rows.push({ left: lines[i], right: lines[i] });
      i++;
      continue;
    }
    const removed: TextDiffLine[] = [], added: TextDiffLine[] = [];
    while (i < lines.length && lines[i].kind === "removed") removed.push(lines[i++]);
    while (i < lines.length && lines[i].kind === "added") added.push(lines[i++]);
    for (let j = 0; j < Math.max(removed.length, added.length); j++) rows.push({ left: removed[j] ?? null, right: added[j] ?? null });
  }
  return rows;
}

export type Collapsed<T> = { kind: "rows"; start: number; rows: T[] } | { kind: "hidden"; start: number; count: number };

/**
 * Splits rows into shown runs and hidden runs of unchanged rows, keeping `context` unchanged rows next to each
 * change; a hidden run shorter than `minHidden` is shown instead (hiding two lines saves nothing).
 */
export function collapseUnchanged<T>(rows: T[], isSame: (row: T) => boolean, context = 3, minHidden = 4): Collapsed<T>[] {
  const keep = rows.map((r) => !isSame(r));
  const near = keep.map((_, i) => keep.slice(Math.max(0, i - context), i + context + 1).some(Boolean));
  const out: Collapsed<T>[] = [];
  for (let i = 0; i < rows.length; ) {
    let j = i;
    while (j < rows.length && near[j] === near[i]) j++;
    if (!near[i] && j - i >= minHidden) out.push({ kind: "hidden", start: i, count: j - i });
    else {
      const last = out[out.length - 1];
      if (last?.kind === "rows") last.rows.push(...rows.slice(i, j));
      else out.push({ kind: "rows", start: i, rows: rows.slice(i, j) });
    }
    i = j;
  }
  return out;
}
