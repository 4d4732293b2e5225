"use client";

import { useState } from "react";
import { ActionForm } from "@/app/_components/action-form";
import { inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { MarkdownPreview } from "@/app/_components/markdown-preview";
import { describeAnchor, REMARK_MAX, type RemarkAnchor } from "@/board/remark-rules";
import { createRemarkAction } from "./actions";

/** A new remark (or a reply): markdown with $inline$ and $$display$$ math, @mentions by e-mail name, optional blocking flag. */
export function RemarkForm({ proposalId, anchor, parentId, mayBlock, clearAnchorHref }: { proposalId: string; anchor: RemarkAnchor; parentId?: string; mayBlock: boolean; clearAnchorHref?: string }) {
  const [text, setText] = useState("");
  const [preview, setPreview] = useState(false);
  const reply = Boolean(parentId);
  return (
    <ActionForm action={createRemarkAction} label={reply ? "Reply" : "Write a remark"} className={reply ? "mt-2" : "rounded-lg border border-rule bg-card p-4"}>
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <input type="hidden" name="anchor" value={JSON.stringify(anchor)} />
          {parentId ? <input type="hidden" name="parentId" value={parentId} /> : null}
          {!reply ? (
            <p className="mb-2 text-sm">
              On <strong>{describeAnchor(anchor)}</strong>
              {anchor.kind !== "proposal" && clearAnchorHref ? (
                <a href={clearAnchorHref} className="ml-2 text-xs text-copper-deep underline">
                  remark on the whole proposal instead
                </a>
              ) : null}
            </p>
          ) : null}
          <label className="block text-sm">
            <span className={reply ? "sr-only" : "mb-1 block font-semibold"}>{reply ? "Reply" : "Remark"}</span>
            {preview ? (
              <div className="min-h-20 rounded-md border border-rule bg-white p-2" data-testid="remark-preview">
                <MarkdownPreview text={text || "_nothing yet_"} />
              </div>
            ) : (
              <textarea
                name="body"
                rows={reply ? 2 : 5}
                maxLength={REMARK_MAX}
                value={text}
                onChange={(e) => setText(e.target.value)}
                className={inputClass}
                placeholder={reply ? "Reply…" : "Markdown; $E_g$ inline, $$ on their own lines for display math; @name to notify a colleague"}
              />
            )}
            {preview ? <input type="hidden" name="body" value={text} /> : null}
          </label>
          {fieldErrors.body ? <p className="text-sm text-danger">{fieldErrors.body.join(" ")}</p> : null}
          <div className="mt-2 flex flex-wrap items-center gap-4">
            {mayBlock && !reply ? (
              <label className="flex items-center gap-1.5 text-sm">
                <input type="checkbox" name="blocking" className="accent-copper" /> ⚑ blocking (acceptance waits until it is resolved)
              </label>
            ) : null}
            <button type="button" onClick={() => setPreview((p) => !p)} className="text-sm text-copper-deep underline">
              {preview ? "Edit" : "Preview"}
            </button>
            <button type="submit" disabled={pending} className={reply ? "rounded-md border border-copper px-3 py-1 text-sm font-semibold text-copper-deep" : primaryButtonClass}>
              {pending ? "Posting…" : reply ? "Reply" : "Post remark"}
            </button>
          </div>
        </>
      )}
    </ActionForm>
  );
}
