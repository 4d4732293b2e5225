import { findBandGap, type GapResult } from "@/lib/tb/analysis/gaps";
import { filledBands } from "./band-edges";
import { placeOnPath, type PathGeometry } from "./band-place";
import { numberRow, textRow, type MetricsReference, type MetricsRow, type MetricsSide } from "./band-rows";

interface GapFacts {
  value: number | null;
  character: string;
  where: string;
  smallestDirect: number | null;
}

function describeGap(gap: GapResult, place: (kIndex: number) => string): GapFacts {
  if (gap.kind === "metal") return { value: null, character: `no gap (${gap.reason})`, where: "—", smallestDirect: null };
  return {
    value: gap.value,
    character: gap.direct ? "direct" : "indirect",
    where: `VBM ${place(gap.vbm.kIndex)}; CBM ${place(gap.cbm.kIndex)}`,
    smallestDirect: gap.smallestDirect.value,
  };
}

function sideGap(s: MetricsSide | null): GapFacts | null {
  if (!s) return null;
  try {
    const { path } = s.metrics.path();
    return describeGap(s.metrics.gap(), (k) => placeOnPath(path.distance[k], path));
  } catch (e) {
    return { value: null, character: e instanceof Error ? e.message.replace(/^gaps: /, "") : "not computable", where: "—", smallestDirect: null };
  }
}

/** Gap of the reference bands themselves, over the points where both edge bands have a value. */
function referenceGap(ref: MetricsReference | null, occupied: number | null, path: PathGeometry): GapFacts | null {
  if (!ref || occupied === null) return null;
  const keep = ref.bands.energies.flatMap((row, k) => {
    const [v, c] = [row[occupied - 1], row[occupied]];
    return v === null || v === undefined || c === null || c === undefined ? [] : [{ k, levels: [v, c] }];
  });
  if (keep.length === 0) return null;
  const gap = findBandGap({ energies: keep.map((x) => x.levels), kFrac: keep.map((x) => ref.bands.kFrac[x.k]), electronCount: 2, spinDegeneracy: 2 });
  return describeGap(gap, (i) => placeOnPath(ref.bands.distance[keep[i].k], path));
}

export function gapRows(b: MetricsSide | null, p: MetricsSide, ref: MetricsReference | null): MetricsRow[] {
  const [gb, gp] = [sideGap(b), sideGap(p)];
  const gr = referenceGap(ref, filledBands(p.doc.electronCount, p.metrics.spinDegeneracy), p.metrics.path().path);
  const pick = <K extends keyof GapFacts>(key: K) => ({ base: gb?.[key], proposed: gp?.[key], reference: gr?.[key] });
  const num = (key: "value" | "smallestDirect") => {
    const v = pick(key);
    return { base: v.base ?? null, proposed: v.proposed ?? null, reference: v.reference ?? null };
  };
  return [
    numberRow("gap", "Band gap", "eV", num("value")),
    textRow("gap-character", "Gap character", pick("character")),
    textRow("gap-where", "Band edges on the path", pick("where")),
    numberRow("gap-direct-min", "Smallest direct gap", "eV", num("smallestDirect")),
  ];
}

function referenceWidths(ref: MetricsReference | null): (number | null)[] {
  if (!ref) return [];
  const count = Math.max(0, ...ref.bands.energies.map((r) => r.length));
  return Array.from({ length: count }, (_, n) => {
    const values = ref.bands.energies.map((r) => r[n]).filter((e): e is number => e !== null && e !== undefined);
    return values.length > 1 ? Math.max(...values) - Math.min(...values) : null;
  });
}

/** Width (max − min along the path) of every band, counted from 1. */
export function bandwidthRows(b: MetricsSide | null, p: MetricsSide, ref: MetricsReference | null): MetricsRow[] {
  const wb = b?.metrics.bandwidths().map((w) => w.width) ?? [];
  const wp = p.metrics.bandwidths().map((w) => w.width);
  const wr = referenceWidths(ref);
  const count = Math.max(wb.length, wp.length, wr.length);
  return Array.from({ length: count }, (_, n) =>
    numberRow(`width/${n + 1}`, `Width of band ${n + 1}`, "eV", { base: wb[n] ?? null, proposed: wp[n] ?? null, reference: wr[n] ?? null }),
  );
}
