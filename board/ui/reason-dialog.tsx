"use client";

import { useEffect, useRef, useState } from "react";

/** Asks for the reason a move needs (decline, send back for revision); Escape or Cancel keeps the card where it is. */
export function ReasonDialog({ title, onSubmit, onCancel }: { title: string; onSubmit: (reason: string) => void; onCancel: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const [reason, setReason] = useState("");
  useEffect(() => {
    ref.current?.showModal();
  }, []);
  return (
    <dialog ref={ref} onCancel={onCancel} aria-labelledby="reason-title" className="m-auto w-full max-w-md rounded-xl border border-rule bg-card p-5 backdrop:bg-ink/30">
      <form
        method="dialog"
        onSubmit={(e) => {
          e.preventDefault();
          if (reason.trim()) onSubmit(reason.trim());
        }}
      >
        <h2 id="reason-title" className="mb-3 text-lg font-semibold">
          {title}
        </h2>
        <label htmlFor="move-reason" className="mb-1 block text-sm font-semibold">
          Reason (kept in the audit trail)
        </label>
        <textarea id="move-reason" value={reason} onChange={(e) => setReason(e.target.value)} rows={4} className="w-full rounded-md border border-rule bg-white p-2" />
        <div className="mt-3 flex justify-end gap-2">
          <button type="button" onClick={onCancel} className="rounded-md border border-rule px-3 py-1.5">
            Cancel
          </button>
          <button type="submit" disabled={!reason.trim()} className="rounded-md bg-copper px-3 py-1.5 font-semibold text-white disabled:opacity-50">
            Move
          </button>
        </div>
      </form>
    </dialog>
  );
}
