import Link from "next/link";
import type { ProposalView } from "@/board/proposal-view";
import { STAGE_META } from "@/board/stages";

/** Family, base → revision, title, stage (glyph and word) and author: the top of every proposal page. */
export function ProposalHeading({ view, prefix = "", children }: { view: ProposalView; prefix?: string; children?: React.ReactNode }) {
  const meta = STAGE_META[view.proposal.stage];
  return (
    <header className="mb-6 mt-2">
      <div className="num text-xs text-ink-soft">
        <Link href={`/families/${view.familySlug}`} className="hover:underline">
          {view.familyTitle}
        </Link>{" "}
        · base {view.baseVersion ?? "none (new model)"} → revision {view.latest?.number ?? 0}
      </div>
      <h1 className="text-2xl font-semibold tracking-tight">
        {prefix}
        {view.proposal.title}
      </h1>
      <p className="mt-1 text-sm">
        <span className="rounded bg-paper-deep px-2 py-0.5 font-semibold" data-testid="proposal-stage">
          {meta.glyph} {meta.label}
        </span>{" "}
        <span className="text-ink-soft">
          by {view.authorName} · {meta.hint}
        </span>
      </p>
      {children}
    </header>
  );
}
