import { formatPath } from "@/lib/tb/document";

/** The editor's working copy: plain JSON that may not (yet) be a valid model document. */
export type Draft = Record<string, unknown>;
export type PathPart = string | number;

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

export function getAt(root: unknown, path: readonly PathPart[]): unknown {
  let at = root;
  for (const part of path) {
    if (Array.isArray(at) && typeof part === "number") at = at[part];
    else if (isRecord(at) && typeof part === "string") at = at[part];
    else return undefined;
  }
  return at;
}

/**
 * A copy of `root` with `value` at `path`, sharing every untouched branch; missing containers are created
 * (an array for a numeric part). `undefined` removes the key, so optional fields disappear rather than turn null.
 */
export function setAt<T>(root: T, path: readonly PathPart[], value: unknown): T {
  if (path.length === 0) return value as T;
  const [head, ...rest] = path;
  if (typeof head === "number") {
    const list = Array.isArray(root) ? [...root] : [];
    list[head] = setAt(list[head], rest, value);
    return list as T;
  }
  const record: Record<string, unknown> = isRecord(root) ? { ...root } : {};
  const next = setAt(record[head], rest, value);
  if (next === undefined) delete record[head];
  else record[head] = next;
  return record as T;
}

/** The engine's own path text ("shells[0].params.sp_sigma"), so editor fields and validator issues share one key. */
export function pathText(path: readonly PathPart[]): string {
  return formatPath(path);
}

/** True when `path` is `ancestor` or lies inside it ("shells[1].index" is inside "shells[1]", not "shells[10]"). */
export function isWithin(path: string, ancestor: string): boolean {
  if (ancestor === "") return true;
  if (!path.startsWith(ancestor)) return false;
  const next = path.charAt(ancestor.length);
  return next === "" || next === "." || next === "[";
}
