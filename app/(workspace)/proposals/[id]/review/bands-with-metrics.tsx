"use client";

import { useState } from "react";
import useSWR from "swr";
import { fetchJson, type ApiError } from "@/lib/client-fetch";
import type { Alignment } from "@/lib/review/alignment";
import type { BandViewData } from "@/lib/review/band-view";
import type { MetricsRow } from "@/lib/review/metrics";
import { metricsQueryString } from "@/lib/review/metrics-query";
import { BandPanel } from "./band-panel";
import { MetricsTable } from "./metrics-table";

type Settings = { alignment: Alignment; window: [number, number] | null };

const ALIGNMENT_TEXT: Record<Alignment, string> = {
  none: "no alignment",
  vbm: "valence-band maxima aligned",
  fermi: "Fermi levels aligned",
  "least-squares": "least-squares shift",
};

/** The band panel and the metrics table under it; the table's reference rows follow the panel's alignment and window. */
export function BandsWithMetrics({ proposalId, data, remarkBase, slug, initial, initialRows }: {
  proposalId: string;
  data: BandViewData;
  remarkBase: string | null;
  slug: string;
  initial: Settings;
  initialRows: MetricsRow[];
}) {
  const [settings, setSettings] = useState<Settings>(initial);
  const query = metricsQueryString(settings);
  const { data: fetched, error, isLoading } = useSWR<{ rows: MetricsRow[] }, ApiError>(
    query === metricsQueryString(initial) ? null : `/api/proposals/${proposalId}/metrics?${query}`,
    (url: string) => fetchJson<{ rows: MetricsRow[] }>(url),
    { keepPreviousData: true, revalidateOnFocus: false },
  );
  const rows = query === metricsQueryString(initial) ? initialRows : (fetched?.rows ?? initialRows);
  return (
    <>
      <BandPanel data={data} remarkBase={remarkBase} initialWindow={initial.window} initialAlignment={initial.alignment} slug={slug} onSettingsChange={setSettings} />
      <div className="mt-6" aria-busy={isLoading}>
        <p className="mb-2 text-xs text-ink-soft" data-testid="metrics-settings" aria-live="polite">
          Reference rows: {ALIGNMENT_TEXT[settings.alignment]}, {settings.window ? `window ${settings.window[0]} to ${settings.window[1]} eV` : "every energy"}
          {isLoading ? " (updating…)" : ""}
          {error ? ` — could not update: ${error.message}` : ""}
        </p>
        <MetricsTable rows={rows} />
      </div>
    </>
  );
}
