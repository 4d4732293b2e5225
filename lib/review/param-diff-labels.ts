import type { ModelDocument } from "@/lib/tb/document";
import { parseBondKey } from "@/lib/tb/orbitals";
import { listParameters } from "@/lib/tb/parameters";

/**
 * Every parameter of a document keyed by what it means. For species, shells and spin–orbit the listParameters key
 * already is the meaning; explicit hoppings are keyed by their list index there, so they are matched here by
 * (from, to, translation) instead, and inserting a hopping does not read as every later hopping changing.
 */
export interface MeaningfulParameter {
  meaning: string;
  key: string;
  value: number;
  group: string;
  label: string;
  /** An imaginary part the document leaves out (read as 0): not listed when its hopping is added or removed. */
  implicit?: boolean;
}

const SYMMETRY: Record<string, string> = { sigma: "σ", pi: "π", delta: "δ" };

export function formatDistance(distance: number): string {
  return `${distance.toFixed(3)} Å`;
}

export function hoppingSignature(h: NonNullable<ModelDocument["hoppings"]>[number]): string {
  return `${h.from.site}:${h.from.orbital} → ${h.to.site}:${h.to.orbital} [${h.translation.join(",")}]`;
}

function bondLabel(name: string): string {
  const bond = parseBondKey(name);
  return bond ? `${bond.from}–${bond.to} ${SYMMETRY[bond.m]} (${name})` : name;
}

export function listMeaningfulParameters(doc: ModelDocument): MeaningfulParameter[] {
  const shellGroup = new Map(doc.shells.map((s) => [`${s.species[0]}-${s.species[1]}/${s.index}`, `${s.species.join("–")} shell ${s.index} (${formatDistance(s.distance)})`]));
  const hoppings = doc.hoppings ?? [];
  const seen = new Map<string, number>();
  const occurrence = hoppings.map((h) => {
    const sig = hoppingSignature(h);
    const n = seen.get(sig) ?? 0;
    seen.set(sig, n + 1);
    return n;
  });
  return listParameters(doc).map((p) => {
    const parts = p.key.split("/");
    const base = { key: p.key, value: p.value };
    if (p.kind === "onsite") return { ...base, meaning: p.key, group: `${parts[1]} on-site`, label: `ε(${parts[2]})` };
    if (p.kind === "bond") return { ...base, meaning: p.key, group: shellGroup.get(`${parts[1]}/${parts[2]}`) ?? parts[1], label: bondLabel(parts[3]) };
    if (p.kind === "soc") return { ...base, meaning: p.key, group: "spin–orbit", label: `λ(${parts[1]})` };
    const i = Number(parts[1]);
    const sig = hoppingSignature(hoppings[i]);
    const part = parts[2] === "re" ? "Re" : "Im";
    const implicit = parts[2] === "im" && hoppings[i].value.im === undefined;
    return { ...base, meaning: `hopping:${sig}#${occurrence[i]}/${parts[2]}`, group: "explicit hoppings", label: `${part} t ${sig}`, ...(implicit ? { implicit } : {}) };
  });
}
