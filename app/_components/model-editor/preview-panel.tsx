"use client";

import { BandPlot, type BandSeries } from "@/app/_components/band-plot";
import type { CheckStatus } from "@/lib/tb/analysis/check-result";
import { formatDelta } from "./deltas";
import type { BandPreview } from "./use-band-preview";

const STATUS: Record<CheckStatus, { glyph: string; word: string; className: string }> = {
  pass: { glyph: "✓", word: "pass", className: "text-ok" },
  warn: { glyph: "!", word: "warn", className: "text-copper-deep" },
  fail: { glyph: "✕", word: "fail", className: "text-danger" },
};

function statusLine(preview: BandPreview, problems: number): { glyph: string; text: string } {
  if (preview.unavailable) return { glyph: "✕", text: `Band preview unavailable: ${preview.unavailable}` };
  if (problems > 0) {
    const why = `the document has ${problems} problem${problems === 1 ? "" : "s"}`;
    return { glyph: "◇", text: preview.result ? `Stale: showing the last valid bands; ${why}` : `No bands yet: ${why}` };
  }
  if (preview.computing) return { glyph: "…", text: "Computing bands in the background…" };
  if (preview.failure) return { glyph: "✕", text: `The engine could not compute these bands: ${preview.failure}` };
  if (preview.result) return { glyph: "✓", text: `Bands up to date (${Math.max(1, Math.round(preview.result.millis))} ms)` };
  return { glyph: "…", text: "Starting the band worker…" };
}

/** Live bands (base dashed slate, proposal solid teal), the gap and each physics check, beside the parameters. */
export function PreviewPanel({ preview, problems, name, hasBase }: { preview: BandPreview; problems: number; name: string; hasBase: boolean }) {
  const { result } = preview;
  const status = statusLine(preview, problems);
  const stale = problems > 0 || preview.failure !== null;
  const series: BandSeries[] = [];
  if (result?.baseEnergies) series.push({ role: "base", label: "base release", energies: result.baseEnergies });
  if (result) series.push({ role: "proposal", label: stale ? "proposal (last valid)" : "proposal", energies: result.energies });
  const gapDelta = result?.gap.value != null && result.baseGap?.value != null ? result.gap.value - result.baseGap.value : null;
  const gapMoved = gapDelta !== null && Math.abs(gapDelta) >= 5e-4;
  return (
    <section aria-label="Band preview" className="space-y-2">
      <p aria-live="polite" className={`text-xs ${stale ? "font-semibold text-copper-deep" : "text-ink-soft"}`}>
        <span aria-hidden>{status.glyph} </span>
        {status.text}
      </p>
      {result ? (
        <div className={stale ? "opacity-60" : undefined}>
          <BandPlot title={`Bands of ${name || "the draft"} along its default path`} distance={result.distance} ticks={result.ticks} series={series} fermiLevel={result.fermiLevel} />
        </div>
      ) : (
        <div className="flex aspect-[760/420] items-center justify-center rounded-xl border border-dashed border-rule text-sm text-ink-soft">no bands yet</div>
      )}
      {result ? (
        <dl className="grid grid-cols-[6.5rem_minmax(0,1fr)] gap-x-2 gap-y-0.5 text-xs">
          <dt className="text-ink-soft">gap</dt>
          <dd className="num">{result.gap.text}</dd>
          {hasBase ? (
            <>
              <dt className="text-ink-soft">base gap</dt>
              <dd className="num">
                {result.baseGap?.text ?? result.baseNote ?? "—"}
                {gapMoved && gapDelta !== null ? <span className="ml-2 text-copper-deep">Δ {formatDelta(gapDelta)} eV</span> : null}
              </dd>
            </>
          ) : null}
        </dl>
      ) : null}
      {result ? (
        <ul aria-label="Physics checks" className="space-y-1 text-xs">
          {result.checks.map((c) => (
            <li key={c.id} className="grid grid-cols-[3.5rem_minmax(0,1fr)] gap-2">
              <span className={`num font-semibold ${STATUS[c.status].className}`}>
                <span aria-hidden>{STATUS[c.status].glyph} </span>
                {STATUS[c.status].word}
              </span>
              <span>
                <span className="font-semibold">{c.title}</span> <span className="text-ink-soft">{c.detail}</span>
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
