import type { ParamDiffRow } from "./param-diff";

/** Pure ordering of parameter-diff rows; imported by the client table too (no engine code here). */
export type ParamSortKey = "effect" | "percent" | "key";

const desc = (a: number | null, b: number | null) => (b === null ? (a === null ? 0 : -1) : a === null ? 1 : Math.abs(b) - Math.abs(a));

export function compareParamRows(by: ParamSortKey): (a: ParamDiffRow, b: ParamDiffRow) => number {
  const byKey = (a: ParamDiffRow, b: ParamDiffRow) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);
  if (by === "key") return byKey;
  if (by === "percent") return (a, b) => desc(a.percent, b.percent) || desc(a.effect, b.effect) || byKey(a, b);
  return (a, b) => desc(a.effect, b.effect) || desc(a.percent, b.percent) || byKey(a, b);
}

export function sortParamRows(rows: ParamDiffRow[], by: ParamSortKey): ParamDiffRow[] {
  return [...rows].sort(compareParamRows(by));
}

/**
 * Rows gathered under their group headers: groups in the order of their first row in the sorted list, so the
 * group holding the largest change comes first, and rows keep the sorted order inside each group.
 */
export function groupParamRows(rows: ParamDiffRow[], by: ParamSortKey): { group: string; rows: ParamDiffRow[] }[] {
  const groups = new Map<string, ParamDiffRow[]>();
  for (const r of sortParamRows(rows, by)) {
    const list = groups.get(r.group);
    if (list) list.push(r);
    else groups.set(r.group, [r]);
  }
  return [...groups].map(([group, list]) => ({ group, rows: list }));
}
