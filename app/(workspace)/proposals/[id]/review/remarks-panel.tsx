import { Markdown } from "@/app/_components/markdown";
import type { SanitizedHtml } from "@/lib/markdown/render";
import { decideRemarkAction, describeAnchor, remarkAnchorSchema, type RemarkAction, type RemarkContext, type RemarkParty } from "@/board/remark-rules";
import type { listRemarks } from "@/board/queries";
import { RemarkControls } from "./remark-controls";
import { RemarkForm } from "./remark-form";

type RemarkRow = Awaited<ReturnType<typeof listRemarks>>[number] & { bodyHtml: SanitizedHtml };

const STATUS = { open: "○ open", addressed: "◐ addressed", resolved: "● resolved" } as const;
const ACTIONS: RemarkAction[] = ["address", "resolve", "reopen"];

function RemarkItem({ r, viewer, ctx, latestRevision, open }: { r: RemarkRow; viewer: RemarkParty; ctx: RemarkContext; latestRevision: number; open: boolean }) {
  const actions = r.parentId || !open ? [] : ACTIONS.filter((a) => decideRemarkAction(viewer, ctx, { writerId: r.writerId, status: r.status }, a) === null);
  return (
    <div data-testid={`remark-${r.id}`}>
      <div className="flex flex-wrap items-baseline gap-x-2 text-xs text-ink-soft">
        <span className="font-semibold text-ink">{r.writerName}</span>
        <span className="num">r{r.revision}</span>
        {r.revision < latestRevision ? <span className="rounded bg-paper-deep px-1">earlier revision</span> : null}
        <span>{r.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC</span>
        {r.updatedAt.getTime() - r.createdAt.getTime() > 1000 && r.status === "open" ? <span>(edited)</span> : null}
      </div>
      <Markdown html={r.bodyHtml} />
      <RemarkControls remarkId={r.id} version={r.version} actions={actions} editable={open && r.writerId === viewer.id} body={r.body} />
    </div>
  );
}

/**
 * Threads by anchor, newest activity last; earlier revisions' remarks stay, marked with their revision. Once the
 * proposal is closed (`open` false) the discussion is read-only: no form, no status buttons, no editing.
 */
export function RemarksPanel({
  proposalId,
  remarks,
  viewer,
  ctx,
  latestRevision,
  open,
  mayWrite: mayWriteWhenOpen,
  mayBlock,
  anchorForNew,
  clearAnchorHref,
}: {
  proposalId: string;
  remarks: RemarkRow[];
  viewer: RemarkParty;
  ctx: RemarkContext;
  latestRevision: number;
  open: boolean;
  mayWrite: boolean;
  mayBlock: boolean;
  anchorForNew: Parameters<typeof RemarkForm>[0]["anchor"];
  clearAnchorHref: string;
}) {
  const roots = remarks.filter((r) => !r.parentId);
  const mayWrite = open && mayWriteWhenOpen;
  return (
    <div className="space-y-4">
      {open ? null : <p className="text-sm text-ink-soft">The discussion closed with the proposal; its remarks are kept as they were.</p>}
      {roots.map((root) => {
        const anchor = remarkAnchorSchema.safeParse(root.anchor);
        return (
          <article key={root.id} aria-label={`Remark by ${root.writerName}`} className={`rounded-lg border bg-card p-3 ${root.blocking && root.status !== "resolved" ? "border-copper" : "border-rule"}`}>
            <header className="mb-1 flex flex-wrap items-center gap-2 text-xs">
              <span className="font-semibold">{STATUS[root.status]}</span>
              {root.blocking ? <span className="rounded bg-copper-pale px-1.5 font-semibold text-copper-deep">⚑ blocking</span> : null}
              <span className="text-ink-soft">on {anchor.success ? describeAnchor(anchor.data) : "the proposal"}</span>
            </header>
            <RemarkItem r={root} viewer={viewer} ctx={ctx} latestRevision={latestRevision} open={open} />
            <div className="ml-4 mt-2 space-y-2 border-l-2 border-rule pl-3">
              {remarks
                .filter((r) => r.parentId === root.id)
                .map((r) => (
                  <RemarkItem key={r.id} r={r} viewer={viewer} ctx={ctx} latestRevision={latestRevision} open={open} />
                ))}
              {mayWrite ? <RemarkForm proposalId={proposalId} anchor={{ kind: "proposal" }} parentId={root.id} mayBlock={false} /> : null}
            </div>
          </article>
        );
      })}
      {roots.length === 0 ? <p className="text-sm text-ink-soft">No remarks yet.</p> : null}
      {mayWrite ? <RemarkForm proposalId={proposalId} anchor={anchorForNew} mayBlock={mayBlock} clearAnchorHref={clearAnchorHref} /> : null}
    </div>
  );
}
