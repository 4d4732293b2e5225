"use client";

import type { DocumentIssue } from "@/lib/tb/document";
import { useEditor } from "./editor-context";

export interface LocatedIssue extends DocumentIssue {
  /** DOM id to focus: the field's input, else its section. */
  target: string;
}

export function focusTarget(id: string): void {
  const el = document.getElementById(id);
  if (!el) return;
  el.scrollIntoView({ block: "center" });
  el.focus({ preventScroll: true });
}

/** Every blocking problem, each a link to its field; announced as it changes. */
export function ProblemSummary({ issues, warningCount }: { issues: LocatedIssue[]; warningCount: number }) {
  const { idFor } = useEditor();
  return (
    <div role="alert" aria-atomic="false" className={issues.length ? "rounded-md border border-danger/40 bg-danger-pale/50 px-3 py-2 text-sm" : "text-sm"}>
      {issues.length ? (
        <>
          <p className="font-semibold text-danger">
            <span aria-hidden>✕ </span>
            {issues.length} problem{issues.length === 1 ? "" : "s"} to fix before this document is valid
          </p>
          <ul className="mt-1 max-h-40 space-y-0.5 overflow-y-auto">
            {issues.map((issue, i) => (
              <li key={`${issue.path}-${i}`}>
                <a
                  href={`#${issue.target}`}
                  className="underline decoration-danger/40 underline-offset-2 hover:decoration-danger"
                  onClick={(e) => {
                    e.preventDefault();
                    focusTarget(issue.target);
                  }}
                >
                  <span className="num text-xs">{issue.path || "(document)"}</span> {issue.message}
                </a>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="text-ok">
          <span aria-hidden>✓ </span>Valid model document
        </p>
      )}
      {warningCount ? (
        <p className="mt-1 text-xs text-ink-soft">
          <span aria-hidden>! </span>
          {warningCount} parameter{warningCount === 1 ? " has" : "s have"} no citation or reason yet (not blocking):{" "}
          <a
            href={`#${idFor("section:citations")}`}
            className="underline underline-offset-2"
            onClick={(e) => {
              e.preventDefault();
              focusTarget(idFor("section:citations"));
            }}
          >
            citations
          </a>
        </p>
      ) : null}
    </div>
  );
}
