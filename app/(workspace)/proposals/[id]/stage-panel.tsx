"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { MoveHint } from "@/board/rules";
import { STAGE_META, type Stage } from "@/board/stages";
import { ReasonDialog } from "@/board/ui/reason-dialog";
import { ApiError, fetchJson } from "@/lib/client-fetch";

/** The moves this person may make from here, each with what still blocks it; the server decides. */
export function StagePanel({ proposalId, version, hints }: { proposalId: string; version: number; hints: MoveHint[] }) {
  const router = useRouter();
  const [pending, setPending] = useState<Stage | null>(null);
  const [asking, setAsking] = useState<Stage | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  async function move(to: Stage, reason?: string) {
    setPending(to);
    setMessage(null);
    try {
      await fetchJson(`/api/proposals/${proposalId}/moves`, { method: "POST", body: { version, to, reason } });
      setMessage({ ok: true, text: `Moved to ${STAGE_META[to].label}.` });
      router.refresh();
    } catch (err) {
      const e = err instanceof ApiError ? err : null;
      setMessage({ ok: false, text: ((e?.details?.reasons as string[] | undefined) ?? [e?.message ?? "The move failed."]).join(" ") });
      if (e?.code === "conflict:stale") router.refresh();
    } finally {
      setPending(null);
    }
  }

  if (hints.length === 0) return <p className="text-sm text-ink-soft">You have no moves to make on this proposal in its current stage.</p>;
  return (
    <div>
      <ul className="space-y-2">
        {hints.map((h) => (
          <li key={h.to} className="flex flex-wrap items-start gap-3">
            <button
              type="button"
              disabled={pending !== null}
              onClick={() => (h.needsReason ? setAsking(h.to) : void move(h.to))}
              className={`rounded-md px-3 py-1.5 text-sm font-semibold ${h.allowed ? "bg-copper text-white hover:bg-copper-deep" : "border border-rule bg-white text-ink-soft"}`}
            >
              {STAGE_META[h.to].glyph} Move to {STAGE_META[h.to].label}
            </button>
            {!h.allowed ? (
              <ul className="flex-1 text-sm text-danger" aria-label={`What blocks ${STAGE_META[h.to].label}`}>
                {h.reasons.map((r) => (
                  <li key={r}>✕ {r}</li>
                ))}
              </ul>
            ) : null}
          </li>
        ))}
      </ul>
      <div role="status" aria-live="polite" className="mt-2 text-sm">
        {message ? <span className={message.ok ? "text-ok" : "text-danger"}>{message.ok ? "✓ " : "✕ "}{message.text}</span> : null}
      </div>
      {asking ? (
        <ReasonDialog
          title={`Move to ${STAGE_META[asking].label}`}
          onCancel={() => setAsking(null)}
          onSubmit={(reason) => {
            const to = asking;
            setAsking(null);
            void move(to, reason);
          }}
        />
      ) : null}
    </div>
  );
}
