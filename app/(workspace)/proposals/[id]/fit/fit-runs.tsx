"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import useSWR from "swr";
import { CostHistoryPlot } from "@/app/_components/cost-history-plot";
import { FormMessage } from "@/app/_components/form-parts";
import { fetchJson, type ApiError } from "@/lib/client-fetch";
import type { FitRunView } from "@/lib/fits/view";

/** The heartbeat is written every ~0.4 s; this much silence means the worker may have stopped. */
const SILENT_MS = 10_000;

const BADGE: Record<FitRunView["status"], string> = {
  queued: "bg-paper-deep text-ink",
  running: "bg-copper-pale text-copper-deep",
  converged: "bg-ok-pale text-ok",
  not_converged: "bg-danger-pale text-danger",
  cancelled: "bg-paper-deep text-ink-soft",
  failed: "bg-danger-pale text-danger",
};

function seconds(ms: number): string {
  if (ms < 1000) return `${Math.round(ms)} ms`;
  return ms < 60_000 ? `${(ms / 1000).toFixed(1)} s` : `${Math.floor(ms / 60_000)} min ${Math.round((ms % 60_000) / 1000)} s`;
}

/** Refits of one proposal, refreshed every second while any is waiting or running. */
export function FitRuns({ proposalId, viewerId, isAdmin, canSave, canRerun, version }: {
  proposalId: string;
  viewerId: string;
  isAdmin: boolean;
  canSave: boolean;
  canRerun: boolean;
  version: number;
}) {
  const url = `/api/proposals/${proposalId}/fits`;
  const { data, error, mutate } = useSWR<{ fits: FitRunView[] }, ApiError>(url, (u: string) => fetchJson<{ fits: FitRunView[] }>(u), {
    refreshInterval: (latest) => (latest?.fits.some((f) => f.active) ? 1000 : 0),
    dedupingInterval: 500,
  });
  const router = useRouter();
  // A run that saved a revision changes the page around the list (start revision, values, version): reload it.
  const saved = useRef<Set<string> | null>(null);
  useEffect(() => {
    if (!data) return;
    const now = new Set(data.fits.filter((f) => f.resultRevision !== null).map((f) => f.id));
    if (saved.current && [...now].some((id) => !saved.current?.has(id))) router.refresh();
    saved.current = now;
  }, [data, router]);
  const [message, setMessage] = useState<{ kind: "error" | "ok"; text: string } | null>(null);

  async function act(fit: FitRunView, action: "cancel" | "rerun" | "apply") {
    setMessage(null);
    try {
      if (action === "apply") {
        const res = await fetchJson<{ revision: number }>(`/api/fits/${fit.id}/apply`, { method: "POST", body: { version } });
        setMessage({ kind: "ok", text: `Saved as revision ${res.revision}.` });
        router.refresh();
      } else {
        await fetchJson(`/api/fits/${fit.id}/${action}`, { method: "POST" });
      }
      await mutate();
    } catch (err) {
      setMessage({ kind: "error", text: (err as ApiError).message });
    }
  }

  if (error) return <FormMessage kind="error">{error.message}</FormMessage>;
  if (!data) return <p className="text-sm text-ink-soft">Loading refits…</p>;
  if (data.fits.length === 0) return <p className="text-sm text-ink-soft">No refits yet.</p>;
  const newest = data.fits[0];
  return (
    <div>
      <p className="sr-only" aria-live="polite">
        {`Newest refit: ${newest.statusLabel}${newest.resultRevision !== null ? `, saved as revision ${newest.resultRevision}` : ""}.`}
      </p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <ol className="space-y-3" aria-label="Refits of this proposal">
        {data.fits.map((f) => (
          <li key={f.id} id={`run-${f.id}`} className="rounded-lg border border-rule bg-card p-3 text-sm target:border-copper" data-testid="fit-run" data-status={f.status}>
            <div className="flex flex-wrap items-center gap-2">
              <span className={`rounded px-2 py-0.5 text-xs font-semibold ${BADGE[f.status]}`} data-testid="fit-status">
                {f.statusLabel}
              </span>
              <span>
                {f.rerunOf ? "Re-run of a stored fit" : "Refit"} of {f.parameters.length} parameter{f.parameters.length === 1 ? "" : "s"} from r{f.baseRevision} to “{f.referenceName}”
              </span>
              <span className="text-xs text-ink-soft">
                by {f.startedBy} · {f.createdAt.slice(0, 16).replace("T", " ")} UTC{f.attempts > 1 ? ` · attempt ${f.attempts}` : ""}{f.interruptions.length > 0 ? ` · resumed ${f.interruptions.length}×` : ""}
              </span>
              <Link href={`/proposals/${proposalId}/fits/${f.id}`} className="ml-auto text-copper-deep underline">
                Fit record →
              </Link>
            </div>
            <div className="mt-2 flex flex-wrap items-center gap-3">
              <div
                role="progressbar"
                aria-label={`Progress of the refit started ${f.createdAt.slice(11, 19)}`}
                aria-valuemin={0}
                aria-valuemax={f.maxIterations}
                aria-valuenow={f.iteration}
                aria-valuetext={`iteration ${f.iteration} of at most ${f.maxIterations}`}
                className="h-2 w-48 overflow-hidden rounded bg-paper-deep"
                data-testid="fit-progress"
              >
                <div className={`h-full ${f.active ? "bg-copper" : "bg-slate-line"}`} style={{ width: f.active ? `${Math.min(100, (100 * f.iteration) / Math.max(1, f.maxIterations))}%` : "100%" }} />
              </div>
              <span className="num text-xs" data-testid="fit-progress-text">
                iteration {f.iteration}
                {f.cost !== null ? ` · best cost ${f.cost.toExponential(3)} eV²` : ""} · {seconds(f.elapsedMs)}
              </span>
              <CostHistoryPlot history={f.history} title="cost per iteration" compact />
            </div>
            <p className="mt-1 text-xs text-ink-soft">{f.settings}</p>
            {f.reproduced ? (
              <p className={`mt-1 text-xs ${f.reproduced.identical ? "text-ok" : "text-danger"}`} data-testid="fit-reproduced">
                {f.reproduced.identical ? "Reproduces the original fit: identical values ✓" : `Differs from the original fit by up to ${f.reproduced.maxDifference.toExponential(2)} eV`}
                {f.reproduced.sameEngine ? "" : " (different engine version)"}
              </p>
            ) : null}
            {f.status === "running" && f.heartbeatAgeMs !== null && f.heartbeatAgeMs > SILENT_MS ? (
              <p className="mt-1 text-xs text-danger">No word from its worker for {seconds(f.heartbeatAgeMs)}; if the worker stopped, the refit is retried on another one.</p>
            ) : null}
            {f.cancelRequested && f.active ? <p className="mt-1 text-xs text-ink-soft">Cancelling: the fit stops at its next step and keeps its best point.</p> : null}
            {f.rms !== null ? (
              <p className="num mt-1 text-xs">
                RMS {f.startRms !== null ? `${(f.startRms * 1000).toFixed(2)} → ` : ""}
                {(f.rms * 1000).toFixed(2)} meV · max {(f.maxAbs! * 1000).toFixed(2)} meV{f.reason ? ` · ${f.reason}` : ""}
              </p>
            ) : null}
            {f.resultRevision !== null ? (
              <p className="mt-1 text-ok" data-testid="fit-result-revision">
                Saved as revision {f.resultRevision}.
              </p>
            ) : null}
            {f.applyNote ? <p className="mt-1 text-xs text-ink-soft">{f.applyNote}</p> : null}
            {f.failureReason ? <p className={`mt-1 text-xs ${f.status === "failed" ? "text-danger" : "text-ink-soft"}`}>{f.failureReason}</p> : null}
            <div className="mt-2 flex gap-3 text-xs">
              {f.active && (f.startedById === viewerId || isAdmin) && !f.cancelRequested ? (
                <button type="button" className="rounded border border-danger px-2 py-1 text-danger hover:bg-danger-pale" onClick={() => act(f, "cancel")}>
                  Cancel
                </button>
              ) : null}
              {!f.active && f.rms !== null && f.resultRevision === null && !f.rerunOf && canSave ? (
                <button type="button" className="rounded border border-copper px-2 py-1 text-copper-deep hover:bg-copper-pale" onClick={() => act(f, "apply")}>
                  Save the best point as a new revision
                </button>
              ) : null}
              {!f.active && f.status !== "failed" && canRerun ? (
                <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-paper-deep" onClick={() => act(f, "rerun")}>
                  Re-run to check it reproduces
                </button>
              ) : null}
            </div>
          </li>
        ))}
      </ol>
    </div>
  );
}
