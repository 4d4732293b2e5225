import type { ModelDocument } from "./document-schema";
import { sha256Hex } from "./sha256";

/**
 * Canonical text of a document: JSON with object keys sorted by UTF-16 code units, array order kept, numbers in
 * ECMAScript's shortest round-trip form (Number.prototype.toString; exact, so nothing is lost), −0 written as 0,
 * and no whitespace (compact) or two-space indentation (pretty, for line diffs). NaN and Infinity are refused.
 */
export function canonicalJson(value: unknown, opts: { pretty?: boolean } = {}): string {
  return write(value, opts.pretty ? "\n" : "", opts.pretty ? "  " : "");
}

function write(value: unknown, newline: string, indent: string): string {
  if (value === null) return "null";
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new Error(`canonical JSON cannot hold ${value}`);
    return Object.is(value, -0) ? "0" : String(value);
  }
  if (typeof value === "string" || typeof value === "boolean") return JSON.stringify(value);
  const inner = newline ? newline + indent : "";
  const sep = newline ? ": " : ":";
  const shift = (s: string) => s.split("\n").join("\n" + indent);
  if (Array.isArray(value)) {
    if (!value.length) return "[]";
    return `[${value.map((v) => inner + shift(write(v, newline, indent))).join(",")}${newline}]`;
  }
  if (typeof value === "object") {
    const keys = Object.keys(value as object)
      .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
      .sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    if (!keys.length) return "{}";
    const body = keys.map((k) => inner + JSON.stringify(k) + sep + shift(write((value as Record<string, unknown>)[k], newline, indent)));
    return `{${body.join(",")}${newline}}`;
  }
  throw new Error(`canonical JSON cannot hold a ${typeof value}`);
}

/** sha256 of the compact canonical text: the checksum of a release. */
export function documentHash(doc: ModelDocument): string {
  return sha256Hex(canonicalJson(doc));
}

/**
 * The parts of a document that change the physics: everything in H(k) (lattice, sites, on-site energies, shells,
 * explicit hoppings, spin–orbit strengths, the Bloch phase convention) plus the electron count. Names, provenance,
 * validity and k-path are left out, so metadata-only edits keep this hash.
 */
export function physicsPart(doc: ModelDocument): unknown {
  return {
    blochPhase: doc.conventions.blochPhase,
    lattice: doc.lattice,
    sites: doc.sites,
    onsite: doc.onsite,
    shells: doc.shells,
    hoppings: doc.hoppings ?? [],
    spinOrbit: doc.spinOrbit ?? {},
    // Not part of H(k), but it moves the Fermi level and decides which gap is the gap, so approvals must lapse with it.
    electronCount: doc.electronCount,
  };
}

export function physicsHash(doc: ModelDocument): string {
  return sha256Hex(canonicalJson(physicsPart(doc)));
}
