import { getAt, isRecord, type PathPart } from "./draft-path";
import { asArray } from "./draft-read";

/** How one field compares with the base document. */
export type FieldChange = { kind: "same" } | { kind: "changed"; delta: number | null } | { kind: "new" };

function findIndex(list: unknown, match: (item: Record<string, unknown>) => boolean): number {
  return asArray(list).findIndex((item) => isRecord(item) && match(item));
}

/**
 * The base's value for a draft field, matched by meaning rather than position: sites by label, shells by species
 * pair and index (so reordering or inserting a shell does not mark every later one changed). undefined when the base
 * has no such field.
 */
export function baseValueAt(draft: unknown, base: unknown, path: readonly PathPart[]): unknown {
  const [head, index, ...rest] = path;
  if ((head === "sites" || head === "shells") && typeof index === "number") {
    const own = getAt(draft, [head, index]);
    if (!isRecord(own)) return undefined;
    const same = (item: Record<string, unknown>) =>
      head === "sites"
        ? item.label === own.label
        : item.index === own.index && JSON.stringify(item.species) === JSON.stringify(own.species);
    const at = findIndex(getAt(base, [head]), same);
    return at < 0 ? undefined : getAt(base, [head, at, ...rest]);
  }
  return getAt(base, path);
}

/** Compares one field with the base; numbers get their difference. Without a base nothing is marked. */
export function fieldChange(draft: unknown, base: unknown | null, path: readonly PathPart[]): FieldChange {
  if (base === null) return { kind: "same" };
  const now = getAt(draft, path);
  const before = baseValueAt(draft, base, path);
  if (before === undefined) return now === undefined || now === "" ? { kind: "same" } : { kind: "new" };
  if (typeof now === "number" && typeof before === "number") return now === before ? { kind: "same" } : { kind: "changed", delta: now - before };
  return JSON.stringify(now) === JSON.stringify(before) ? { kind: "same" } : { kind: "changed", delta: null };
}

/** "+0.100", "−2.50e-5": signed, a true minus sign, three decimals or two significant digits for tiny changes. */
export function formatDelta(delta: number): string {
  const magnitude = Math.abs(delta);
  const body = magnitude >= 1e-3 || magnitude === 0 ? magnitude.toFixed(3) : magnitude.toExponential(2);
  return `${delta < 0 ? "−" : "+"}${body}`;
}
