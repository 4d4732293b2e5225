/** The stages a proposal moves through, and how the board shows them (a glyph and a word, never colour alone). */
export const STAGES = ["draft", "submitted", "under_review", "revision", "accepted", "released", "declined", "withdrawn"] as const;
export type Stage = (typeof STAGES)[number];

export const LANE_STAGES: readonly Stage[] = ["draft", "submitted", "under_review", "revision", "accepted", "released"];
export const ARCHIVE_STAGES: readonly Stage[] = ["declined", "withdrawn"];
export const CLOSED_STAGES: readonly Stage[] = ["released", "declined", "withdrawn"];

export const STAGE_META: Record<Stage, { label: string; glyph: string; hint: string }> = {
  draft: { label: "Draft", glyph: "✎", hint: "being written by its author" },
  submitted: { label: "Submitted", glyph: "⇥", hint: "waiting for a curator to assign reviewers" },
  under_review: { label: "Under review", glyph: "◎", hint: "reviewers are reading diffs and bands" },
  revision: { label: "Revision", glyph: "↺", hint: "back with the author for a new revision" },
  accepted: { label: "Accepted", glyph: "✓", hint: "passed the gate, waiting to be released" },
  released: { label: "Released", glyph: "◆", hint: "published in the registry" },
  declined: { label: "Declined", glyph: "✕", hint: "closed by a curator" },
  withdrawn: { label: "Withdrawn", glyph: "⌫", hint: "closed by its author" },
};

export const VERDICTS = ["accept", "minor_revision", "major_revision", "decline"] as const;
export type Verdict = (typeof VERDICTS)[number];

export const VERDICT_LABEL: Record<Verdict, string> = {
  accept: "accept",
  minor_revision: "minor revision",
  major_revision: "major revision",
  decline: "decline",
};

export function isStage(value: string): value is Stage {
  return (STAGES as readonly string[]).includes(value);
}
