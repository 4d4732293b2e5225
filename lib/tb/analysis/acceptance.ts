import { z } from "zod";
import type { CheckResult } from "./check-result";
import type { DocumentMetrics } from "./metrics";

/** Acceptance criteria of a model family, stored as data and evaluated on every revision. Energies in eV. */
const window = z.tuple([z.number(), z.number()]).refine(([a, b]) => a < b, { message: "window must be [low, high] with low < high" });
const referenceFit = {
  /** Model band index; all bands in the window when omitted. */
  band: z.number().int().min(0).optional(),
  window: window.optional(),
  max: z.number().positive(),
  alignment: z.enum(["none", "vbm", "fermi", "least-squares"]).default("vbm"),
  bandOffset: z.number().int().default(0),
  /** Required for alignment "fermi": the reference bands' Fermi level. */
  referenceFermi: z.number().optional(),
};

export const ACCEPTANCE_CRITERION_SCHEMA = z.discriminatedUnion("metric", [
  z.strictObject({ metric: z.literal("gap"), target: z.number(), tolerance: z.number().positive() }),
  z.strictObject({ metric: z.literal("gap-character"), direct: z.boolean() }),
  z.strictObject({ metric: z.literal("rms"), ...referenceFit }),
  z.strictObject({ metric: z.literal("max-error"), ...referenceFit }),
  z.strictObject({
    metric: z.literal("mass"),
    edge: z.enum(["vbm", "cbm"]),
    direction: z.array(z.number()).min(1).max(3),
    /** |m*|/mₑ. */
    target: z.number().positive(),
    tolerance: z.number().positive(),
  }),
  z.strictObject({ metric: z.literal("bandwidth"), band: z.number().int().min(0), target: z.number().nonnegative(), tolerance: z.number().positive() }),
]);
export const ACCEPTANCE_CRITERIA_SCHEMA = z.array(ACCEPTANCE_CRITERION_SCHEMA);
export type AcceptanceCriterion = z.infer<typeof ACCEPTANCE_CRITERION_SCHEMA>;
export type AcceptanceCriterionInput = z.input<typeof ACCEPTANCE_CRITERION_SCHEMA>;

type Outcome = { ok: boolean; measured: number | null; detail: string };

function within(measured: number, target: number, tolerance: number, what: string, unit: string): Outcome {
  const ok = Math.abs(measured - target) <= tolerance;
  return { ok, measured, detail: `${what} ${measured.toFixed(4)}${unit}, target ${target} ± ${tolerance}${unit}` };
}

function evaluate(c: AcceptanceCriterion, m: DocumentMetrics): Outcome {
  const gap = m.gap();
  switch (c.metric) {
    case "gap":
      return gap.kind === "insulator" ? within(gap.value, c.target, c.tolerance, "gap", " eV") : { ok: false, measured: null, detail: `no gap: ${gap.reason}` };
    case "gap-character":
      if (gap.kind !== "insulator") return { ok: false, measured: null, detail: `no gap: ${gap.reason}` };
      return { ok: gap.direct === c.direct, measured: gap.value, detail: `gap is ${gap.direct ? "direct" : "indirect"}, required ${c.direct ? "direct" : "indirect"}` };
    case "bandwidth": {
      const bw = m.bandwidths()[c.band];
      return bw ? within(bw.width, c.target, c.tolerance, `width of band ${c.band}`, " eV") : { ok: false, measured: null, detail: `band ${c.band} does not exist` };
    }
    case "mass": {
      const mass = m.mass(c.edge, c.direction);
      if (!mass) return { ok: false, measured: null, detail: `no ${c.edge}: the model has no gap` };
      return within(Math.abs(mass.massRatio), c.target, c.tolerance, `|m*|/mₑ at the ${c.edge} along (${c.direction.join(", ")})`, "");
    }
    case "rms":
    case "max-error": {
      const occupiedBands = Math.round(m.model.electronCount / m.spinDegeneracy);
      const needFermi = c.alignment === "fermi";
      if (needFermi && c.referenceFermi === undefined) return { ok: false, measured: null, detail: "alignment 'fermi' needs referenceFermi" };
      const cmp = m.compareReference({
        alignment: c.alignment,
        window: c.window,
        bandOffset: c.bandOffset,
        occupiedBands,
        modelFermi: needFermi ? m.fermiLevel() : undefined,
        referenceFermi: c.referenceFermi,
      });
      if (!cmp) return { ok: false, measured: null, detail: "no reference bands to compare with" };
      const scope = c.band === undefined ? cmp : cmp.perBand.find((b) => b.modelBand === c.band);
      if (!scope || scope.points === 0) return { ok: false, measured: null, detail: "no reference values in the window for this band" };
      const value = c.metric === "rms" ? scope.rms : scope.maxAbs;
      const name = `${c.metric === "rms" ? "RMS" : "max |ΔE|"}${c.band === undefined ? "" : ` of band ${c.band}`}`;
      return { ok: value <= c.max, measured: value, detail: `${name} ${value.toFixed(4)} eV over ${scope.points} points (limit ${c.max} eV, ${c.alignment} alignment)` };
    }
  }
}

export function evaluateAcceptance(criteria: AcceptanceCriterionInput[], metrics: DocumentMetrics): CheckResult[] {
  const parsed = ACCEPTANCE_CRITERIA_SCHEMA.parse(criteria);
  return parsed.map((c, i) => {
    const o = evaluate(c, metrics);
    return { id: `acceptance-${i + 1}-${c.metric}`, title: `Acceptance: ${c.metric}`, status: o.ok ? "pass" : "fail", detail: o.detail, measured: o.measured };
  });
}
