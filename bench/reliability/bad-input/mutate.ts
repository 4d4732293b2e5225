import { NASTY_NUMBERS, NASTY_VALUES, raw, type Labelled } from "./values";

export type Rng = () => number;
type Key = string | number;
type Json = unknown;

export function pick<T>(rng: Rng, items: readonly T[]): T {
  return items[Math.floor(rng() * items.length)];
}

/** A deep copy that keeps own "__proto__" keys (JSON.parse defines them as plain properties). */
export function clone<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

function isObject(v: Json): v is Record<string, Json> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Every path to a node below the root, depth-first, at most `maxDepth` keys long. */
export function pathsOf(value: Json, maxDepth = 10, prefix: Key[] = []): Key[][] {
  if (prefix.length >= maxDepth) return [];
  const entries: [Key, Json][] = Array.isArray(value) ? value.map((v, i) => [i, v]) : isObject(value) ? Object.entries(value) : [];
  return entries.flatMap(([k, v]) => [[...prefix, k], ...pathsOf(v, maxDepth, [...prefix, k])]);
}

function parentOf(root: Json, path: Key[]): Json {
  return path.slice(0, -1).reduce<Json>((node, k) => (node as Record<Key, Json>)[k], root);
}

export function describePath(path: Key[]): string {
  return path.map((k) => (typeof k === "number" ? `[${k}]` : `.${k}`)).join("") || "(root)";
}

export function setAt(root: Json, path: Key[], value: Json): Json {
  if (!path.length) return value;
  const copy = clone(root);
  (parentOf(copy, path) as Record<Key, Json>)[path.at(-1)!] = value;
  return copy;
}

function getAt(root: Json, path: Key[]): Json {
  return path.reduce<Json>((node, k) => (node as Record<Key, Json>)[k], root);
}

const EXTREME_NUMBERS: readonly Labelled<unknown>[] = [...NASTY_NUMBERS, ["NaN-like raw", raw("1e-999999")]];

/**
 * One seeded change to a JSON value: replace a node by a nasty value, delete it, add a stray key, change its type,
 * repeat an array element, empty an array, wrap a node, or push a number to an extreme. Returns the new value and
 * a one-line description for the report.
 */
export function mutateOnce(rng: Rng, value: Json): { value: Json; summary: string } {
  const paths = pathsOf(value);
  if (!paths.length) {
    const [label, v] = pick(rng, NASTY_VALUES);
    return { value: v, summary: `whole value → ${label}` };
  }
  const path = pick(rng, paths);
  const at = describePath(path);
  const node = getAt(value, path);
  const op = Math.floor(rng() * 8);
  switch (op) {
    case 0: {
      const [label, v] = pick(rng, NASTY_VALUES);
      return { value: setAt(value, path, v), summary: `${at} → ${label}` };
    }
    case 1: {
      const copy = clone(value);
      const parent = parentOf(copy, path);
      if (Array.isArray(parent)) parent.splice(path.at(-1) as number, 1);
      else delete (parent as Record<string, Json>)[path.at(-1) as string];
      return { value: copy, summary: `${at} removed` };
    }
    case 2: {
      const [label, v] = pick(rng, NASTY_VALUES);
      const target = isObject(node) ? path : path.slice(0, -1);
      const host = getAt(value, target);
      if (!isObject(host)) return { value: setAt(value, path, v), summary: `${at} → ${label}` };
      return { value: setAt(value, [...target, "unexpectedKey"], v), summary: `${describePath(target)}.unexpectedKey = ${label}` };
    }
    case 3: {
      const retyped = typeof node === "number" ? String(node) : typeof node === "string" ? node.length : Array.isArray(node) ? { ...node } : isObject(node) ? [node] : String(node);
      return { value: setAt(value, path, retyped), summary: `${at} retyped (${typeof node === "object" ? (Array.isArray(node) ? "array" : node === null ? "null" : "object") : typeof node} → ${Array.isArray(retyped) ? "array" : typeof retyped})` };
    }
    case 4: {
      const host = Array.isArray(node) ? path : Array.isArray(parentOf(value, path)) ? path.slice(0, -1) : null;
      if (!host) return { value: setAt(value, path, [node, node]), summary: `${at} doubled into an array` };
      const arr = getAt(value, host) as Json[];
      const times = 2 + Math.floor(rng() * 7);
      return { value: setAt(value, host, Array.from({ length: arr.length * times }, (_, i) => arr[i % Math.max(1, arr.length)])), summary: `${describePath(host)} repeated ×${times}` };
    }
    case 5: {
      const host = Array.isArray(node) ? path : path.slice(0, -1);
      return { value: setAt(value, host, Array.isArray(getAt(value, host)) ? [] : {}), summary: `${describePath(host)} emptied` };
    }
    case 6:
      return rng() < 0.5 ? { value: setAt(value, path, [node]), summary: `${at} wrapped in an array` } : { value: setAt(value, path, { value: node }), summary: `${at} wrapped in an object` };
    default: {
      const numeric = paths.filter((p) => typeof getAt(value, p) === "number");
      const target = numeric.length ? pick(rng, numeric) : path;
      const [label, v] = pick(rng, EXTREME_NUMBERS);
      return { value: setAt(value, target, v), summary: `${describePath(target)} → ${label}` };
    }
  }
}

/** One to three seeded changes. */
export function mutate(rng: Rng, value: Json): { value: Json; summary: string } {
  const count = 1 + Math.floor(rng() * 3);
  let current = value;
  const parts: string[] = [];
  for (let i = 0; i < count; i++) {
    const step = mutateOnce(rng, current);
    current = step.value;
    parts.push(step.summary);
  }
  return { value: current, summary: parts.join("; ") };
}

/** Text-level damage: a byte string cut, spliced or corrupted at a seeded place. */
export function damageText(rng: Rng, text: string): { bytes: Buffer; summary: string } {
  const at = Math.floor(rng() * text.length);
  const base = Buffer.from(text, "utf8");
  const cut = Buffer.byteLength(text.slice(0, at), "utf8");
  const inserts: Labelled<Buffer>[] = [
    ["NUL byte", Buffer.from([0])],
    ["CR/LF", Buffer.from("\r\n")],
    ["bad UTF-8 FF FE", Buffer.from([0xff, 0xfe])],
    ["bad UTF-8 C3 28", Buffer.from([0xc3, 0x28])],
    ["UTF-8 surrogate ED A0 80", Buffer.from([0xed, 0xa0, 0x80])],
    ["overlong C0 AF", Buffer.from([0xc0, 0xaf])],
    ["BOM", Buffer.from([0xef, 0xbb, 0xbf])],
    ["quote", Buffer.from('"')],
    ["comma", Buffer.from(",")],
  ];
  const op = Math.floor(rng() * 3);
  if (op === 0) return { bytes: base.subarray(0, cut), summary: `cut at byte ${cut} of ${base.length}` };
  const [label, bytes] = pick(rng, inserts);
  if (op === 1) return { bytes: Buffer.concat([base.subarray(0, cut), bytes, base.subarray(cut)]), summary: `${label} inserted at byte ${cut}` };
  return { bytes: Buffer.concat([base.subarray(0, cut), bytes, base.subarray(Math.min(base.length, cut + bytes.length))]), summary: `${label} written over byte ${cut}` };
}
