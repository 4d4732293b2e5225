export type ReleaseStatus = "current" | "deprecated" | "withdrawn";

/** A withdrawn release stays readable but flagged; withdrawal outranks deprecation. */
export function releaseStatus(r: { deprecatedAt: Date | null; withdrawnAt: Date | null }): ReleaseStatus {
  return r.withdrawnAt ? "withdrawn" : r.deprecatedAt ? "deprecated" : "current";
}

export const STATUS_TEXT: Record<ReleaseStatus, { glyph: string; label: string }> = {
  current: { glyph: "●", label: "Current" },
  deprecated: { glyph: "◐", label: "Deprecated" },
  withdrawn: { glyph: "⊘", label: "Withdrawn" },
};
