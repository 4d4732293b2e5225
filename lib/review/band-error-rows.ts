import type { ReferenceComparison } from "@/lib/tb/analysis/compare-reference";
import { ALIGNMENT_LABEL } from "./alignment";
import { filledBands } from "./band-edges";
import { formatNumber } from "./band-format";
import { numberRow, textRow, type MetricsReference, type MetricsRow, type MetricsSide } from "./band-rows";
import type { MetricsOptions } from "./metrics";

type Outcome = { ok: true; cmp: ReferenceComparison } | { ok: false; reason: string };

function compare(s: MetricsSide, ref: MetricsReference, opts: MetricsOptions): Outcome {
  if (opts.alignment === "fermi" && ref.fermiLevel === null) return { ok: false, reason: "the reference states no Fermi level" };
  const occupied = filledBands(s.doc.electronCount, s.metrics.spinDegeneracy);
  if (opts.alignment === "vbm" && occupied === null) return { ok: false, reason: "no valence-band maximum (partly filled band)" };
  try {
    const cmp = s.metrics.compareReference({
      alignment: opts.alignment,
      window: opts.window ?? undefined,
      occupiedBands: occupied ?? undefined,
      modelFermi: opts.alignment === "fermi" ? s.metrics.fermiLevel() : undefined,
      referenceFermi: ref.fermiLevel ?? undefined,
    });
    return cmp ? { ok: true, cmp } : { ok: false, reason: "no reference bands" };
  } catch (e) {
    return { ok: false, reason: e instanceof Error ? e.message.replace(/^compare: /, "") : "not comparable" };
  }
}

/**
 * RMS and largest |E_model − E_reference| against the reference inside the window, over all bands and per band,
 * with the reference aligned onto each document as chosen (bands paired by index from the lowest).
 */
export function errorRows(b: MetricsSide | null, p: MetricsSide, ref: MetricsReference | null, opts: MetricsOptions): MetricsRow[] {
  if (!ref) return [];
  const [ob, op] = [b ? compare(b, ref, opts) : null, compare(p, ref, opts)];
  const cb = ob?.ok ? ob.cmp : null;
  const cp = op.ok ? op.cmp : null;
  const scope = `${opts.window ? `${formatNumber(opts.window[0], 2)} to ${formatNumber(opts.window[1], 2)} eV` : "all energies"}, ${ALIGNMENT_LABEL[opts.alignment]}`;
  const rows: MetricsRow[] = [];
  const failed = (o: Outcome | null) => (o && !o.ok ? `not compared: ${o.reason}` : undefined);
  if (!cp || (ob && !cb)) rows.push(textRow("reference-compare", `Comparison with ${ref.name}`, { base: failed(ob), proposed: failed(op) }));
  rows.push(
    numberRow("shift", `Shift applied to ${ref.name}`, "eV", { base: cb?.shift ?? null, proposed: cp?.shift ?? null, reference: null }),
    numberRow("points", `Reference values compared (${scope})`, "", { base: cb?.points ?? null, proposed: cp?.points ?? null, reference: null }, 0),
    numberRow("rms", "RMS error, all bands in the window", "eV", { base: cb?.rms ?? null, proposed: cp?.rms ?? null, reference: null }),
    numberRow("max", "Max |error|, all bands in the window", "eV", { base: cb?.maxAbs ?? null, proposed: cp?.maxAbs ?? null, reference: null }),
  );
  const bands = [...new Set([...(cp?.perBand ?? []), ...(cb?.perBand ?? [])].map((x) => x.modelBand))].sort((x, y) => x - y);
  for (const n of bands) {
    const [eb, ep] = [cb?.perBand.find((x) => x.modelBand === n), cp?.perBand.find((x) => x.modelBand === n)];
    rows.push(
      numberRow(`rms/${n + 1}`, `RMS error, band ${n + 1}`, "eV", { base: eb?.rms ?? null, proposed: ep?.rms ?? null, reference: null }),
      numberRow(`max/${n + 1}`, `Max |error|, band ${n + 1}`, "eV", { base: eb?.maxAbs ?? null, proposed: ep?.maxAbs ?? null, reference: null }),
    );
  }
  return rows;
}
