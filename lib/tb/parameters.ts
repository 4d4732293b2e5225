import type { ModelDocument } from "./document-schema";

/** One scalar of a document that H(k) depends on linearly. */
export interface ParameterRef {
  key: string;
  value: number;
  kind: "onsite" | "bond" | "soc" | "hopping";
  label: string;
}

export function shellKey(species: [string, string], index: number): string {
  return `${species[0]}-${species[1]}/${index}`;
}

/**
 * Every scalar parameter with a stable key, in document order:
 * onsite/<species>/<orbital>, shell/<A>-<B>/<index>/<sk key>, soc/<species>, hopping/<i>/re, hopping/<i>/im.
 */
export function listParameters(doc: ModelDocument): ParameterRef[] {
  const out: ParameterRef[] = [];
  for (const [species, orbitals] of Object.entries(doc.onsite)) {
    for (const [orbital, value] of Object.entries(orbitals)) {
      out.push({ key: `onsite/${species}/${orbital}`, value, kind: "onsite", label: `ε(${species}, ${orbital})` });
    }
  }
  for (const shell of doc.shells) {
    const sk = shellKey(shell.species, shell.index);
    for (const [name, value] of Object.entries(shell.params)) {
      out.push({ key: `shell/${sk}/${name}`, value, kind: "bond", label: `${name} (${shell.species.join("–")}, shell ${shell.index})` });
    }
  }
  for (const [species, value] of Object.entries(doc.spinOrbit ?? {})) {
    out.push({ key: `soc/${species}`, value, kind: "soc", label: `λ(${species})` });
  }
  (doc.hoppings ?? []).forEach((h, i) => {
    const what = `${h.from.site}:${h.from.orbital} → ${h.to.site}:${h.to.orbital} [${h.translation.join(",")}]`;
    out.push({ key: `hopping/${i}/re`, value: h.value.re, kind: "hopping", label: `Re t ${what}` });
    out.push({ key: `hopping/${i}/im`, value: h.value.im ?? 0, kind: "hopping", label: `Im t ${what}` });
  });
  return out;
}

/** key → human label, for tables and messages. */
export function parameterLabels(doc: ModelDocument): Record<string, string> {
  return Object.fromEntries(listParameters(doc).map((p) => [p.key, p.label]));
}

export function getParameter(doc: ModelDocument, key: string): number {
  const found = listParameters(doc).find((p) => p.key === key);
  if (!found) throw new Error(`unknown parameter key "${key}"`);
  return found.value;
}

function assertFinite(key: string, value: number): void {
  if (!Number.isFinite(value)) throw new Error(`parameter ${key}: value must be finite, got ${value}`);
}

/** A new document with the given parameters replaced; the input is not modified. Unknown keys throw. */
export function setParameters(doc: ModelDocument, values: Record<string, number>): ModelDocument {
  const next: ModelDocument = structuredClone(doc);
  for (const [key, value] of Object.entries(values)) {
    assertFinite(key, value);
    const parts = key.split("/");
    if (parts[0] === "onsite" && parts.length === 3 && next.onsite[parts[1]]?.[parts[2]] !== undefined) {
      next.onsite[parts[1]][parts[2]] = value;
    } else if (parts[0] === "shell" && parts.length === 4) {
      const shell = next.shells.find((s) => shellKey(s.species, s.index) === `${parts[1]}/${parts[2]}`);
      if (!shell || shell.params[parts[3]] === undefined) throw new Error(`unknown parameter key "${key}"`);
      shell.params[parts[3]] = value;
    } else if (parts[0] === "soc" && parts.length === 2 && next.spinOrbit?.[parts[1]] !== undefined) {
      next.spinOrbit[parts[1]] = value;
    } else if (parts[0] === "hopping" && parts.length === 3 && (parts[2] === "re" || parts[2] === "im")) {
      const hop = next.hoppings?.[Number(parts[1])];
      if (!hop || !/^\d+$/.test(parts[1])) throw new Error(`unknown parameter key "${key}"`);
      hop.value[parts[2]] = value;
    } else {
      throw new Error(`unknown parameter key "${key}"`);
    }
  }
  return next;
}
