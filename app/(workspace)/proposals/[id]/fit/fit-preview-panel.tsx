"use client";

import useSWR from "swr";
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

function Problems({ lines }: { lines: string[] }) {
  return (
    <div role="status" className="mb-3 rounded-md bg-danger-pale px-3 py-2 text-sm text-danger" data-testid="fit-preview-error">
      {lines.length === 1 ? (
        lines[0]
      ) : (
        <ul className="list-disc pl-5">
          {lines.map((l) => (
            <li key={l}>{l}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function FitPreviewPanel({ preview, error, loading, localErrors, window, regions, labels, describeFields }: {
  preview: FitPreview | undefined;
  error: ApiError | undefined;
  loading: boolean;
  localErrors: string[];
  window: [number, number] | null;
  regions: { from: number; to: number; weight: number }[];
  labels: Record<string, string>;
  describeFields: (fieldErrors: Record<string, string[]>) => string[];
}) {
  const problems = localErrors.length
    ? localErrors
    : error
      ? error.fieldErrors && Object.keys(error.fieldErrors).length
        ? describeFields(error.fieldErrors)
        : [error.message]
      : [];
  const named = (keys: string[]) => keys.map((k) => labels[k] ?? k).join(", ");
  return (
    <div aria-busy={loading}>
      {problems.length ? <Problems lines={problems} /> : null}
      {preview && !problems.length ? (
        <>
          <p className="mb-2 text-sm" data-testid="fit-preview-summary" role="status">
            <strong className="num">{preview.points}</strong> reference values at <strong className="num">{preview.kPoints}</strong> k-points enter the fit
            for <strong className="num">{preview.parameters}</strong> free parameter{preview.parameters === 1 ? "" : "s"};{" "}
            <span className="num">{preview.excluded}</span> are left out. Alignment shift at the start:{" "}
            <span className="num">{preview.shift.toFixed(3)}</span> eV.
          </p>
          {preview.undetermined ? (
            <p role="note" className="mb-2 rounded-md bg-danger-pale px-3 py-2 text-sm text-danger" data-testid="fit-preview-insensitive">
              {preview.insensitive.length
                ? `No value in the fit changes with ${named(preview.insensitive)} (by symmetry, or because the alignment shift takes the change up), so the fit cannot determine ${preview.insensitive.length === 1 ? "it" : "them"}. Fix ${preview.insensitive.length === 1 ? "it" : "them"} to start.`
                : "Some combination of the free parameters changes no value in the fit, so the fit cannot determine them all. Fix one of the parameters that act together to start."}
            </p>
          ) : null}
          <FitPreviewPlot plot={preview.plot} window={window} regions={regions} />
          <ul className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink-soft" aria-label="Legend of the preview">
            <li>● violet: in the fit (darker = heavier weight)</li>
            <li>○ grey: left out</li>
            <li>┄ slate: model bands at the start values</li>
            {window ? <li>┄ copper: window</li> : null}
            {regions.length ? <li>▮ shaded: weighted regions</li> : null}
          </ul>
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
      {!preview && !problems.length ? <p className="text-sm text-ink-soft">Working out which values enter the fit…</p> : null}
    </div>
  );
}
