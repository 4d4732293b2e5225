"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/lib/client-fetch";

type Action = "address" | "resolve" | "reopen";
const LABEL: Record<Action, string> = { address: "Mark addressed", resolve: "Resolve", reopen: "Reopen" };

/** Status buttons and editing for one remark; only the moves this person may make are offered, the server decides. */
export function RemarkControls({ remarkId, version, actions, editable, body }: { remarkId: string; version: number; actions: Action[]; editable: boolean; body: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(body);
  const [busy, setBusy] = useState(false);

  async function send(payload: Record<string, unknown>) {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/remarks/${remarkId}`, { method: "PATCH", body: { version, ...payload } });
      setEditing(false);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "That did not work.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="mt-1">
      {editing ? (
        <div>
          <label className="sr-only" htmlFor={`edit-${remarkId}`}>
            Edit remark
          </label>
          <textarea id={`edit-${remarkId}`} value={text} onChange={(e) => setText(e.target.value)} rows={4} className="w-full rounded-md border border-rule bg-white p-2 text-sm" />
          <div className="flex gap-2">
            <button type="button" disabled={busy} onClick={() => send({ body: text })} className="rounded border border-copper px-2 py-0.5 text-xs font-semibold text-copper-deep">
              Save edit
            </button>
            <button type="button" onClick={() => setEditing(false)} className="text-xs underline">
              Cancel
            </button>
          </div>
        </div>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {actions.map((a) => (
          <button key={a} type="button" disabled={busy} onClick={() => send({ action: a })} className="rounded border border-rule bg-white px-2 py-0.5 text-xs hover:border-copper">
            {LABEL[a]}
          </button>
        ))}
        {editable && !editing ? (
          <button type="button" onClick={() => setEditing(true)} className="text-xs text-copper-deep underline">
            Edit
          </button>
        ) : null}
      </div>
      {error ? (
        <p role="alert" className="text-xs text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
