"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormMessage } from "@/app/_components/form-parts";
import { fetchJson, type ApiError } from "@/lib/client-fetch";

/** Starts a re-run of this record and opens its page, where the comparison with the original appears when it ends. */
export function RerunButton({ proposalId, fitId }: { proposalId: string; fitId: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function rerun() {
    setBusy(true);
    setError(null);
    try {
      const res = await fetchJson<{ fitId: string }>(`/api/fits/${fitId}/rerun`, { method: "POST" });
      router.push(`/proposals/${proposalId}/fit#run-${res.fitId}`);
    } catch (err) {
      setError((err as ApiError).message);
      setBusy(false);
    }
  }
  return (
    <div className="mt-3">
      {error ? <FormMessage kind="error">{error}</FormMessage> : null}
      <button type="button" disabled={busy} onClick={rerun} className="rounded border border-copper px-3 py-1.5 text-sm font-semibold text-copper-deep hover:bg-copper-pale disabled:opacity-60">
        {busy ? "Starting…" : "Re-run to check it reproduces"}
      </button>
    </div>
  );
}
