import type { ChangeAssessment } from "./change-level";

export interface ChangedValue {
  key: string;
  label: string;
  base: number | null;
  proposed: number | null;
}

const MAX_LISTED = 40;

function formatValue(v: number | null): string {
  return v === null ? "—" : String(v);
}

function describeChange(c: ChangedValue): string {
  if (c.base === null) return `- ${c.label} (\`${c.key}\`): added, ${formatValue(c.proposed)} eV`;
  if (c.proposed === null) return `- ${c.label} (\`${c.key}\`): removed (was ${formatValue(c.base)} eV)`;
  const delta = c.proposed - c.base;
  return `- ${c.label} (\`${c.key}\`): ${formatValue(c.base)} → ${formatValue(c.proposed)} eV (Δ ${delta >= 0 ? "+" : ""}${Number(delta.toPrecision(6))} eV)`;
}

/** The changelog the release form starts from: the keyed parameter diff, why the level was chosen, and the rationale. */
export function draftChangelog(input: {
  title: string;
  baseVersion: string | null;
  assessment: ChangeAssessment;
  changes: readonly ChangedValue[];
  rationale: string;
}): string {
  const lines = [`${input.title} (${input.assessment.level} change${input.baseVersion ? ` from ${input.baseVersion}` : ""}).`, ""];
  for (const reason of input.assessment.reasons) lines.push(`- ${reason}`);
  if (input.changes.length) {
    lines.push("", "Changed parameters:");
    for (const c of input.changes.slice(0, MAX_LISTED)) lines.push(describeChange(c));
    if (input.changes.length > MAX_LISTED) lines.push(`- … and ${input.changes.length - MAX_LISTED} more.`);
  }
  const rationale = input.rationale.trim();
  if (rationale) lines.push("", "Rationale:", "", rationale);
  return lines.join("\n");
}
