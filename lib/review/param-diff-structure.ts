import type { ModelDocument } from "@/lib/tb/document";
import { formatDistance, hoppingSignature } from "./param-diff-labels";

export type StructuralKind =
  | "orbital-added" | "orbital-removed" | "shell-added" | "shell-removed" | "site-added" | "site-removed"
  | "hopping-added" | "hopping-removed" | "lattice-changed" | "electron-count-changed";

export interface StructuralChange {
  kind: StructuralKind;
  text: string;
}

const vector = (v: readonly number[]) => `(${v.join(", ")})`;
/** "a → b" with six significant digits, or every digit when six do not tell them apart. */
function change(a: number, b: number): string {
  const short = (x: number) => String(Number(x.toPrecision(6)));
  return short(a) === short(b) ? `${a} → ${b}` : `${short(a)} → ${short(b)}`;
}

const sameVector = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/**
 * What changed in the document's structure rather than in its parameter values. Geometry that is not a parameter
 * (primitive vectors, site positions, shell distances and tolerances) is reported as "lattice-changed".
 */
export function listStructuralChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  return [...latticeChanges(base, proposed), ...siteChanges(base, proposed), ...shellChanges(base, proposed), ...hoppingChanges(base, proposed), ...electronChanges(base, proposed)];
}

function latticeChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  const a = base.lattice, b = proposed.lattice;
  if (a.dimension !== b.dimension) return [{ kind: "lattice-changed", text: `lattice dimension ${a.dimension} → ${b.dimension}` }];
  const out: StructuralChange[] = [];
  const n = Math.max(a.vectors.length, b.vectors.length);
  for (let i = 0; i < n; i++) {
    const u = a.vectors[i], v = b.vectors[i];
    if (!u || !v || !sameVector(u, v)) out.push({ kind: "lattice-changed", text: `primitive vector a${i + 1} ${u ? vector(u) : "none"} → ${v ? vector(v) : "none"} Å` });
  }
  return out;
}

function siteChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  const after = new Map(proposed.sites.map((s) => [s.label, s]));
  const before = new Map(base.sites.map((s) => [s.label, s]));
  const out: StructuralChange[] = [];
  for (const s of base.sites) {
    const t = after.get(s.label);
    if (!t || t.species !== s.species) {
      out.push({ kind: "site-removed", text: `site ${s.label} (${s.species}) removed` });
      continue;
    }
    if (!sameVector(s.position, t.position)) out.push({ kind: "lattice-changed", text: `site ${s.label} moved ${vector(s.position)} → ${vector(t.position)} Å` });
    for (const o of s.orbitals) if (!t.orbitals.includes(o)) out.push({ kind: "orbital-removed", text: `orbital ${o} removed from site ${s.label} (${s.species})` });
    for (const o of t.orbitals) if (!s.orbitals.includes(o)) out.push({ kind: "orbital-added", text: `orbital ${o} added on site ${s.label} (${s.species})` });
  }
  for (const t of proposed.sites) {
    const s = before.get(t.label);
    if (!s || s.species !== t.species) out.push({ kind: "site-added", text: `site ${t.label} (${t.species}) added at ${vector(t.position)} Å with ${t.orbitals.join(", ")}` });
  }
  return out;
}

function shellChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  const key = (s: ModelDocument["shells"][number]) => `${s.species.join("–")} shell ${s.index}`;
  const before = new Map(base.shells.map((s) => [key(s), s]));
  const after = new Map(proposed.shells.map((s) => [key(s), s]));
  const out: StructuralChange[] = [];
  for (const [name, s] of before) {
    const t = after.get(name);
    if (!t) out.push({ kind: "shell-removed", text: `${name} (${formatDistance(s.distance)}) removed` });
    else if (t.distance !== s.distance) out.push({ kind: "lattice-changed", text: `${name} distance ${change(s.distance, t.distance)} Å` });
    else if ((t.tolerance ?? null) !== (s.tolerance ?? null)) out.push({ kind: "lattice-changed", text: `${name} distance tolerance ${s.tolerance ?? "default"} → ${t.tolerance ?? "default"} Å` });
  }
  for (const [name, t] of after) if (!before.has(name)) out.push({ kind: "shell-added", text: `${name} (${formatDistance(t.distance)}) added` });
  return out;
}

function hoppingChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  const remaining = (proposed.hoppings ?? []).map(hoppingSignature);
  const out: StructuralChange[] = [];
  for (const h of base.hoppings ?? []) {
    const sig = hoppingSignature(h);
    const at = remaining.indexOf(sig);
    if (at >= 0) remaining.splice(at, 1);
    else out.push({ kind: "hopping-removed", text: `hopping ${sig} removed` });
  }
  for (const sig of remaining) out.push({ kind: "hopping-added", text: `hopping ${sig} added` });
  return out;
}

function electronChanges(base: ModelDocument, proposed: ModelDocument): StructuralChange[] {
  if (base.electronCount === proposed.electronCount) return [];
  return [{ kind: "electron-count-changed", text: `electron count per cell ${base.electronCount} → ${proposed.electronCount}` }];
}
