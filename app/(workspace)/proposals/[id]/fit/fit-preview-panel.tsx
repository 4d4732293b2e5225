"use client";

import useSWR from "swr";
import { FormMessage } from "@/app/_components/form-parts";
import { fetchJson, type ApiError } from "@/lib/client-fetch";
import type { FitPreview } from "@/lib/fits/preview";
import type { FitSpecInput } from "@/lib/fits/spec";
import { FitPreviewPlot } from "./fit-preview-plot";

/** Asks the server what the fit would use (the same checks as starting it) whenever the settings settle. */
export function useFitPreview(proposalId: string, spec: FitSpecInput | null) {
  const key = spec ? [`/api/proposals/${proposalId}/fits/preview`, JSON.stringify(spec)] : null;
  return useSWR<FitPreview, ApiError>(key, ([url, body]: [string, string]) => fetchJson<FitPreview>(url, { method: "POST", body: JSON.parse(body) }), {
    revalidateOnFocus: false,
    keepPreviousData: true,
  });
}

export function FitPreviewPanel({ preview, error, loading, localErrors, window }: {
  preview: FitPreview | undefined;
  error: ApiError | undefined;
  loading: boolean;
  localErrors: string[];
  window: [number, number] | null;
}) {
  if (localErrors.length > 0) {
    return (
      <FormMessage kind="error">
        <span data-testid="fit-preview-error">{localErrors.join("; ")}.</span>
      </FormMessage>
    );
  }
  return (
    <div aria-busy={loading}>
      {error ? (
        <FormMessage kind="error">
          <span data-testid="fit-preview-error">{error.message}</span>
        </FormMessage>
      ) : null}
      {preview && !error ? (
        <>
          <p className="mb-2 text-sm" data-testid="fit-preview-summary" role="status">
            <strong className="num">{preview.points}</strong> reference values at <strong className="num">{preview.kPoints}</strong> k-points enter the fit
            for <strong className="num">{preview.parameters}</strong> free parameter{preview.parameters === 1 ? "" : "s"};{" "}
            <span className="num">{preview.excluded}</span> are left out. Alignment shift at the start:{" "}
            <span className="num">{preview.shift.toFixed(3)}</span> eV.
          </p>
          {preview.insensitive.length > 0 ? (
            <p role="note" className="mb-2 rounded-md bg-danger-pale px-3 py-2 text-sm text-danger" data-testid="fit-preview-insensitive">
              No value in the fit depends on {preview.insensitive.join(", ")} at the start values, so the fit cannot determine{" "}
              {preview.insensitive.length === 1 ? "it" : "them"} (no uncertainty can be given). Fix {preview.insensitive.length === 1 ? "it" : "them"}, or widen the window or bands.
            </p>
          ) : null}
          <FitPreviewPlot plot={preview.plot} window={window} />
          {preview.plot.stride > 1 ? <p className="text-xs text-ink-soft">Every {preview.plot.stride}th value is drawn; the counts include all.</p> : null}
          <table className="mt-3 w-full text-sm">
            <caption className="sr-only">Bands in the fit</caption>
            <thead>
              <tr className="text-left text-xs text-ink-soft">
                <th className="py-1">Model band</th>
                <th>Reference band</th>
                <th className="text-right">Values</th>
                <th className="text-right">Weight</th>
              </tr>
            </thead>
            <tbody>
              {preview.perBand.map((b) => (
                <tr key={b.referenceBand} className="border-t border-rule">
                  <td className="num py-1">{b.modelBand}</td>
                  <td className="num">{b.referenceBand}</td>
                  <td className="num text-right">{b.points}</td>
                  <td className="num text-right">{b.minWeight === b.maxWeight ? b.maxWeight : `${b.minWeight}–${b.maxWeight}`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
      {!preview && !error ? <p className="text-sm text-ink-soft">Working out which values enter the fit…</p> : null}
    </div>
  );
}
