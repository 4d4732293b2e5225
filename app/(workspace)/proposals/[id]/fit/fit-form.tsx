"use client";

import { useMemo, useState } from "react";
import { useSWRConfig } from "swr";
import { FormMessage, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { fetchJson, type ApiError } from "@/lib/client-fetch";
import { checkAgainstReference, describeFieldErrors, initialFitForm, toFitSpec, type FitFormState } from "@/lib/fits/form";
import { FitPreviewPanel, useFitPreview } from "./fit-preview-panel";
import { ParameterTable } from "./parameter-table";
import { useDebounced } from "./use-debounced";
import { WeightRows } from "./weight-rows";

export interface ReferenceChoice {
  id: string;
  name: string;
  points: number;
  bands: number;
}

const small = "w-28 rounded-md border border-rule bg-white px-2 py-1.5 num text-sm focus:border-copper focus:outline-none";

/** The refit settings with a live preview of what enters the fit; starting hands it to a background worker. */
export function FitForm({ proposalId, parameters, references, canStart }: {
  proposalId: string;
  parameters: { key: string; label: string; value: number }[];
  references: ReferenceChoice[];
  canStart: boolean;
}) {
  const [state, setState] = useState<FitFormState>(() => initialFitForm(parameters, references[0]?.id ?? ""));
  const [message, setMessage] = useState<{ kind: "error" | "ok"; text: string } | null>(null);
  const [starting, setStarting] = useState(false);
  const { mutate } = useSWRConfig();
  const set = (patch: Partial<FitFormState>) => setState((s) => ({ ...s, ...patch }));
  const labels = useMemo(() => Object.fromEntries(parameters.map((p) => [p.key, p.label])), [parameters]);
  const current = useMemo(() => new Map(parameters.map((p) => [p.key, p.value])), [parameters]);
  const bandCount = references.find((r) => r.id === state.referenceSetId)?.bands ?? Infinity;
  const { spec, errors } = useMemo(() => {
    const read = toFitSpec(state);
    return { spec: read.spec, errors: [...read.errors, ...checkAgainstReference(read.spec, bandCount)] };
  }, [state, bandCount]);
  // Start values follow the latest revision (a finished refit may have saved a new one); the settings stay.
  const rows = state.rows.map((r) => ({ ...r, value: current.get(r.key) ?? r.value }));
  const settled = useDebounced(errors.length === 0 ? spec : null, 400);
  const preview = useFitPreview(proposalId, settled);
  const window = spec.window ?? null;

  async function start() {
    setStarting(true);
    setMessage(null);
    try {
      const res = await fetchJson<{ fitId: string; preview: { points: number } }>(`/api/proposals/${proposalId}/fits`, { method: "POST", body: spec });
      setMessage({ kind: "ok", text: `Refit started (${res.preview.points} reference values). Its progress is shown below.` });
      await mutate(`/api/proposals/${proposalId}/fits`);
    } catch (err) {
      setMessage({ kind: "error", text: (err as ApiError).message });
    } finally {
      setStarting(false);
    }
  }

  return (
    <div className="grid gap-8 xl:grid-cols-[minmax(0,1fr)_minmax(0,40rem)]">
      <div className="min-w-0">
        {canStart ? null : (
          <p role="note" className="mb-4 rounded-md bg-paper-deep px-3 py-2 text-sm">
            Preview only: try settings and see what would enter a fit. Only the proposal&apos;s author can start a refit, while the proposal is a draft or returned for revision.
          </p>
        )}
        <label className="mb-4 block">
          <span className="mb-1 block text-sm font-semibold">Reference band set</span>
          <select className={inputClass} value={state.referenceSetId} onChange={(e) => set({ referenceSetId: e.target.value })}>
            {references.map((r) => (
              <option key={r.id} value={r.id}>
                {r.name} — {r.points} k-points × {r.bands} bands
              </option>
            ))}
          </select>
        </label>
        <h3 className="mb-2 text-sm font-semibold">Free parameters and bounds</h3>
        <ParameterTable rows={rows} onChange={(next) => set({ rows: next })} />
        <div className="mt-4 flex flex-wrap gap-4">
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Band offset</span>
            <input className={small} value={state.bandOffset} onChange={(e) => set({ bandOffset: e.target.value })} aria-describedby="offset-hint" />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Alignment</span>
            <select className={small.replace("w-28", "w-56")} value={state.alignment} onChange={(e) => set({ alignment: e.target.value as FitFormState["alignment"] })}>
              <option value="none">none (same energy zero)</option>
              <option value="vbm">valence-band maxima</option>
              <option value="least-squares">least-squares shift</option>
            </select>
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Window from (eV)</span>
            <input className={small} value={state.windowLower} onChange={(e) => set({ windowLower: e.target.value })} placeholder="all" />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-semibold">to (eV)</span>
            <input className={small} value={state.windowUpper} onChange={(e) => set({ windowUpper: e.target.value })} placeholder="all" />
          </label>
        </div>
        <p id="offset-hint" className="mb-4 mt-1 text-xs text-ink-soft">
          Model band n is compared with reference band n + offset (e.g. 1 when the reference has one semicore band below the model&apos;s). The window applies to the aligned reference energies.
        </p>
        <WeightRows legend="Weights per reference band (others weigh 1)" rows={state.bandWeights} columns={[{ field: "band", label: "band" }, { field: "weight", label: "weight" }]} blank={{ band: "0", weight: "2" }} onChange={(bandWeights) => set({ bandWeights })} />
        <WeightRows
          legend="Weights per region along the path (1/Å; overlapping regions multiply)"
          rows={state.regionWeights}
          columns={[{ field: "from", label: "from" }, { field: "to", label: "to" }, { field: "weight", label: "weight" }]}
          blank={{ from: "0", to: "0.5", weight: "2" }}
          onChange={(regionWeights) => set({ regionWeights })}
        />
        <div className="flex flex-wrap gap-4">
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Maximum iterations</span>
            <input className={small} value={state.maxIterations} onChange={(e) => set({ maxIterations: e.target.value })} />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Extra starts</span>
            <input className={small} value={state.restarts} onChange={(e) => set({ restarts: e.target.value })} />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-semibold">Seed</span>
            <input className={small} value={state.seed} onChange={(e) => set({ seed: e.target.value })} />
          </label>
        </div>
        <p className="mt-1 text-xs text-ink-soft">Extra starts are drawn within the bounds (or ±25 % around the start) from the seed; the best fit is kept. The same seed gives the same starts.</p>
      </div>
      <div className="min-w-0">
        <h3 className="mb-2 text-sm font-semibold">What enters the fit</h3>
        <FitPreviewPanel
          preview={preview.data}
          error={preview.error}
          loading={preview.isLoading || preview.isValidating}
          localErrors={errors}
          window={window}
          regions={(spec.regionWeights ?? []).filter((r) => Number.isFinite(r.from) && Number.isFinite(r.to))}
          labels={labels}
          describeFields={(fieldErrors) => describeFieldErrors(fieldErrors, spec, labels)}
        />
        <div className="mt-4">
          {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
          {canStart ? (
            <button type="button" className={primaryButtonClass} disabled={starting || errors.length > 0 || Boolean(preview.error) || !preview.data || preview.data.undetermined} onClick={start}>
              {starting ? "Starting…" : "Start the refit"}
            </button>
          ) : (
            <p className="text-sm text-ink-soft">Only the proposal&apos;s author can start a refit, while the proposal is a draft or returned for revision.</p>
          )}
        </div>
      </div>
    </div>
  );
}
