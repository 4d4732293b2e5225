import { sameKPoint } from "@/lib/tb/analysis/gaps";
import { deltaE } from "./alignment";
import type { BandViewData } from "./band-view";

export interface BandCsvOptions {
  /** Path-distance range (1/Å) of the current view; all points when absent. */
  range?: [number, number] | null;
  /** Digits after the point for energies. */
  digits?: number;
}

const SAME = 1e-9;

function quote(cell: string): string {
  return /[",\n\r]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

const columns = (prefix: string, count: number) => Array.from({ length: count }, (_, n) => `${prefix}_${n + 1} (eV)`);

/**
 * The band comparison as CSV: one row per path point (distance, k1…kd, base bands, proposed bands, ΔE = proposed − base
 * per band, then each reference set's bands). A reference point that is not one of the path points gets a row of its own,
 * placed by distance. Energies are those of the view given (pass the aligned view to export what is on screen).
 */
export function buildBandCsv(view: BandViewData, opts: BandCsvOptions = {}): string {
  const digits = opts.digits ?? 6;
  const num = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "" : v.toFixed(digits));
  const dim = view.path.kFrac[0]?.length ?? 0;
  const nBase = view.base?.[0]?.length ?? 0;
  const nProp = view.proposed[0]?.length ?? 0;
  const { perBandK } = deltaE(view);
  const nDelta = perBandK[0]?.length ?? 0;
  const refWidths = view.references.map((r) => Math.max(0, ...r.energies.map((row) => row.length)));
  const header = [
    "distance (1/Å)",
    ...Array.from({ length: dim }, (_, i) => `k${i + 1}`),
    ...columns("base", nBase),
    ...columns("proposed", nProp),
    ...columns("dE", nDelta),
    ...view.references.flatMap((r, i) => columns(r.name, refWidths[i])),
  ];
  type Row = { distance: number; kFrac: number[]; path: number | null; refs: ((number | null)[] | null)[] };
  const rows: Row[] = view.path.distance.map((distance, i) => ({ distance, kFrac: view.path.kFrac[i], path: i, refs: view.references.map(() => null) }));
  view.references.forEach((r, ri) => {
    r.energies.forEach((levels, p) => {
      const at = rows.findIndex((row) => row.path !== null && Math.abs(row.distance - r.distance[p]) < SAME && sameKPoint(row.kFrac, r.kFrac[p]));
      if (at >= 0 && rows[at].refs[ri] === null) rows[at].refs[ri] = levels;
      else rows.push({ distance: r.distance[p], kFrac: r.kFrac[p], path: null, refs: view.references.map((_, j) => (j === ri ? levels : null)) });
    });
  });
  const ordered = rows.map((row, order) => ({ row, order })).sort((a, b) => a.row.distance - b.row.distance || a.order - b.order);
  const [lo, hi] = opts.range ?? [-Infinity, Infinity];
  const lines = ordered
    .filter(({ row }) => row.distance >= lo - SAME && row.distance <= hi + SAME)
    .map(({ row }) => {
      const i = row.path;
      const pad = (values: readonly (number | null)[] | null | undefined, count: number) => Array.from({ length: count }, (_, n) => num(values?.[n]));
      return [
        row.distance.toFixed(6),
        ...Array.from({ length: dim }, (_, c) => (row.kFrac[c] ?? 0).toFixed(6)),
        ...pad(i === null ? null : view.base?.[i], nBase),
        ...pad(i === null ? null : view.proposed[i], nProp),
        ...pad(i === null ? null : perBandK[i], nDelta),
        ...row.refs.flatMap((levels, ri) => pad(levels, refWidths[ri])),
      ].join(",");
    });
  return [header.map(quote).join(","), ...lines].join("\n") + "\n";
}
