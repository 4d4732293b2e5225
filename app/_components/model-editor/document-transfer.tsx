"use client";

import { useRef, useState } from "react";
import { canonicalJson } from "@/lib/tb/canonical";
import { DOCUMENT_MAX_BYTES, DOCUMENT_TOO_LARGE } from "@/lib/size-limits";
import { validateModelDocument, type DocumentIssue } from "@/lib/tb/document";
import type { Draft } from "./draft-path";
import { asText } from "./draft-read";
import { smallButtonClass } from "./section-frame";

type Notice = { kind: "ok"; text: string } | { kind: "error"; text: string; issues: DocumentIssue[] };

export function downloadName(name: string): string {
  return `${name.trim().replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^[.-]+/, "") || "model"}.json`;
}

/** Upload replaces the draft only with a valid document; download writes the canonical text, pretty. */
export function DocumentTransfer({ draft, onReplace, basisLimit }: { draft: Draft; onReplace: (doc: Draft) => void; basisLimit?: number }) {
  const fileInput = useRef<HTMLInputElement>(null);
  const [notice, setNotice] = useState<Notice | null>(null);

  const upload = async (file: File) => {
    if (file.size > DOCUMENT_MAX_BYTES) {
      setNotice({ kind: "error", text: `${DOCUMENT_TOO_LARGE} Nothing was replaced.`, issues: [] });
      return;
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(await file.text());
    } catch (error) {
      setNotice({ kind: "error", text: `${file.name} is not JSON (${error instanceof Error ? error.message : "unreadable"}); nothing was replaced.`, issues: [] });
      return;
    }
    const report = validateModelDocument(parsed, { maxBasis: basisLimit });
    if (report.oversize) {
      setNotice({ kind: "error", text: `${report.errors[0].message} Nothing was replaced.`, issues: [] });
      return;
    }
    if (!report.document) {
      setNotice({ kind: "error", text: `${file.name} is not a valid model document; nothing was replaced.`, issues: report.errors });
      return;
    }
    onReplace(parsed as Draft);
    setNotice({ kind: "ok", text: `Loaded ${file.name}.` });
  };

  const download = () => {
    let text: string;
    try {
      text = canonicalJson(draft, { pretty: true });
    } catch (error) {
      setNotice({ kind: "error", text: `Cannot write the document: ${error instanceof Error ? error.message : "unknown reason"}.`, issues: [] });
      return;
    }
    const url = URL.createObjectURL(new Blob([text + "\n"], { type: "application/json" }));
    const link = document.createElement("a");
    link.href = url;
    link.download = downloadName(asText(draft.name));
    link.click();
    URL.revokeObjectURL(url);
  };

  return (
    <div className="text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className={smallButtonClass} onClick={() => fileInput.current?.click()}>
          Upload document…
        </button>
        <input
          ref={fileInput}
          type="file"
          accept="application/json,.json"
          className="sr-only"
          aria-label="Upload a model document (JSON)"
          tabIndex={-1}
          onChange={(e) => {
            const file = e.target.files?.[0];
            e.target.value = "";
            if (file) void upload(file);
          }}
        />
        <button type="button" className={smallButtonClass} onClick={download}>
          Download {downloadName(asText(draft.name))}
        </button>
      </div>
      {notice ? (
        <div role={notice.kind === "error" ? "alert" : "status"} className={`mt-1.5 text-xs ${notice.kind === "error" ? "text-danger" : "text-ok"}`}>
          <p>
            <span aria-hidden>{notice.kind === "error" ? "✕ " : "✓ "}</span>
            {notice.text}
          </p>
          {notice.kind === "error" && notice.issues.length ? (
            <ul className="mt-0.5 max-h-28 list-inside list-disc overflow-y-auto">
              {notice.issues.map((i, n) => (
                <li key={n}>
                  <span className="num">{i.path || "(document)"}</span> {i.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
