import { compareFreeElectron } from "@/lib/tb/analysis/free-electron";
import { sameKPoint } from "@/lib/tb/analysis/gaps";
import { computeEffectiveMass } from "@/lib/tb/analysis/masses";
import { pathDirections } from "./band-place";
import { numberRow, type MetricsReference, type MetricsRow, type MetricsSide } from "./band-rows";

type Column = "base" | "proposed" | "reference";
const EDGE_NAME = { vbm: "valence maximum", cbm: "conduction minimum" } as const;

/** Effective mass (in mₑ) at each band edge along every path direction that meets it; negative at a maximum (hole-like). */
function sideMasses(s: MetricsSide): Map<string, { metric: string; value: number }> {
  const out = new Map<string, { metric: string; value: number }>();
  let gap;
  try {
    gap = s.metrics.gap();
  } catch {
    return out;
  }
  if (gap.kind !== "insulator") return out;
  const { path } = s.metrics.path();
  const reciprocal = s.metrics.model.reciprocal;
  for (const edge of ["vbm", "cbm"] as const) {
    const at = gap[edge];
    for (const d of pathDirections(at.kIndex, path, reciprocal)) {
      const mass = computeEffectiveMass(s.metrics.solve, { band: at.band, kFrac: at.kFrac, direction: d.direction, reciprocal });
      out.set(`mass/${edge}/${d.label}`, { metric: `m* at the ${EDGE_NAME[edge]}, along ${d.label}`, value: mass.massRatio });
    }
  }
  return out;
}

export function massRows(b: MetricsSide | null, p: MetricsSide): MetricsRow[] {
  const sides = { base: b ? sideMasses(b) : new Map(), proposed: sideMasses(p) };
  const keys = [...new Set([...sides.proposed.keys(), ...sides.base.keys()])];
  return keys.map((key) => {
    const [vb, vp] = [sides.base.get(key), sides.proposed.get(key)];
    return numberRow(key, (vp ?? vb).metric, "mₑ", { base: vb?.value ?? null, proposed: vp?.value ?? null, reference: null });
  });
}

/** Least-squares fit of E − E(Γ) = ħ²k²/2m* to the lowest band within FIT_RADIUS of Γ. */
export const FIT_RADIUS = 0.2;

function fitLowest(kFrac: number[][], energies: number[], gammaEnergy: number, reciprocal: number[][]): number | null {
  try {
    return compareFreeElectron({ kFrac, energies, gammaEnergy, reciprocal, radius: FIT_RADIUS }).massRatio;
  } catch {
    // no path point within the fit radius of Γ: the path does not pass Γ
    return null;
  }
}

function sideFreeElectron(s: MetricsSide | null): number | null {
  if (!s) return null;
  const { path, energies } = s.metrics.path();
  const gamma = s.metrics.solve(new Array<number>(s.metrics.model.dimension).fill(0))[0];
  return fitLowest(path.kFrac, energies.map((row) => row[0]), gamma, s.metrics.model.reciprocal);
}

function referenceFreeElectron(ref: MetricsReference | null, reciprocal: number[][]): number | null {
  if (!ref) return null;
  const kept = ref.bands.energies.flatMap((row, k) => (row[0] === null || row[0] === undefined ? [] : [{ k: ref.bands.kFrac[k], e: row[0] }]));
  const gamma = kept.find((x) => sameKPoint(x.k, x.k.map(() => 0)));
  return gamma ? fitLowest(kept.map((x) => x.k), kept.map((x) => x.e), gamma.e, reciprocal) : null;
}

export function freeElectronRows(b: MetricsSide | null, p: MetricsSide, ref: MetricsReference | null): MetricsRow[] {
  const values: Record<Column, number | null> = {
    base: sideFreeElectron(b),
    proposed: sideFreeElectron(p),
    reference: referenceFreeElectron(ref, p.metrics.model.reciprocal),
  };
  return [numberRow("free-electron", `Free-electron m* of the lowest band (ħ²k²/2m* within ${FIT_RADIUS} Å⁻¹ of Γ)`, "mₑ", values)];
}
