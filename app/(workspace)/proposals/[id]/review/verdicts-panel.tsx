import { Markdown } from "@/app/_components/markdown";
import { VERDICT_LABEL } from "@/board/stages";
import type { ProposalView } from "@/board/proposal-view";
import type { SanitizedHtml } from "@/lib/markdown/render";
import { VerdictForm } from "../verdict-form";

/** Every verdict ever given; those on older physics are marked stale but stay readable. */
export function VerdictsPanel({ proposalId, verdicts, required, fresh, mayGive }: { proposalId: string; verdicts: (ProposalView["verdicts"][number] & { summaryHtml: SanitizedHtml })[]; required: number; fresh: number; mayGive: boolean }) {
  return (
    <div>
      <p className="mb-2 text-sm">
        Fresh accept verdicts:{" "}
        <strong className="num" data-testid="fresh-accepts">
          {fresh} / {required}
        </strong>
      </p>
      <ul className="mb-3 space-y-3 text-sm">
        {verdicts.map((v) => (
          <li key={v.id} data-testid="verdict" data-fresh={v.fresh} className={v.fresh ? "" : "opacity-60"}>
            <div>
              <span className="font-semibold">{VERDICT_LABEL[v.verdict]}</span> by {v.reviewerName} on r{v.revision}{" "}
              {v.fresh ? null : <span className="rounded bg-paper-deep px-1 text-xs">stale: the physics changed since</span>}
            </div>
            <Markdown html={v.summaryHtml} />
          </li>
        ))}
        {verdicts.length === 0 ? <li className="text-ink-soft">No verdicts yet.</li> : null}
      </ul>
      {mayGive ? <VerdictForm proposalId={proposalId} /> : null}
    </div>
  );
}
