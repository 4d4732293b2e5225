import { STATUS_TEXT, type ReleaseStatus } from "@/lib/registry/status";

/** Release status by glyph and word, never by colour alone. */
export function StatusBadge({ status }: { status: ReleaseStatus }) {
  const { glyph, label } = STATUS_TEXT[status];
  return (
    <span className="rounded bg-paper-deep px-2 py-0.5 text-xs font-semibold" data-testid="release-status">
      <span aria-hidden="true">{glyph}</span> {label}
    </span>
  );
}
