import { findBandGap } from "@/lib/tb/analysis/gaps";
import { filledBands } from "@/lib/review/band-edges";
import { formatNumber } from "@/lib/review/band-format";
import { placeOnPath } from "@/lib/review/band-place";
import type { BandViewData } from "@/lib/review/band-view";

function edges(rows: number[][] | null, view: BandViewData) {
  const occupied = filledBands(view.electronCount, view.spinDegeneracy);
  if (!rows || occupied === null || occupied >= (rows[0]?.length ?? 0)) return null;
  const gap = findBandGap({ energies: rows, kFrac: view.path.kFrac, electronCount: occupied * 2, spinDegeneracy: 2, ticks: view.path.ticks });
  const at = (k: number | undefined) => (k === undefined ? "—" : placeOnPath(view.path.distance[k], view.path));
  return {
    vbm: gap.vbm ? `${formatNumber(gap.vbm.energy)} eV at ${at(gap.vbm.kIndex)}` : "—",
    cbm: gap.cbm ? `${formatNumber(gap.cbm.energy)} eV at ${at(gap.cbm.kIndex)}` : "—",
    gap: gap.kind === "insulator" ? `${formatNumber(gap.value)} eV, ${gap.direct ? "direct" : "indirect"}` : `none (${gap.reason})`,
  };
}

/** The plot as text: band edges, gap and the largest |ΔE| with its place, in the aligned energies on screen. */
export function BandKeyPoints({ view, delta }: { view: BandViewData; delta: { perK: number[]; perBandK: number[][] } }) {
  const sides = [
    { name: "Base", e: edges(view.base, view) },
    { name: "Proposed", e: edges(view.proposed, view) },
  ].filter((s) => s.e !== null);
  let worst: { k: number; n: number; d: number } | null = null;
  delta.perBandK.forEach((row, k) => row.forEach((d, n) => (worst === null || Math.abs(d) > Math.abs(worst.d) ? (worst = { k, n, d }) : null)));
  const w = worst as { k: number; n: number; d: number } | null;
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-copper-deep">Key points of the plot as text</summary>
      <table className="mt-2 text-left">
        <thead>
          <tr className="text-xs text-ink-soft">
            <th className="pr-4 font-semibold">Series</th>
            <th className="pr-4 font-semibold">Valence maximum</th>
            <th className="pr-4 font-semibold">Conduction minimum</th>
            <th className="font-semibold">Gap</th>
          </tr>
        </thead>
        <tbody>
          {sides.map((s) => (
            <tr key={s.name}>
              <th className="pr-4 font-normal">{s.name}</th>
              <td className="num pr-4">{s.e?.vbm}</td>
              <td className="num pr-4">{s.e?.cbm}</td>
              <td className="num">{s.e?.gap}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2">
        Largest |ΔE| (proposed − base):{" "}
        {w ? (
          <span className="num">
            {formatNumber(w.d)} eV in band {w.n + 1} at {placeOnPath(view.path.distance[w.k], view.path)}
          </span>
        ) : (
          "no base release to compare with"
        )}
      </p>
    </details>
  );
}
