import { z } from "zod";

/**
 * What a modeller chooses for a refit, as stored in the fit record. Everything needed to re-run it lives here or in
 * the record's base revision and reference set; nothing is read from the environment.
 */
export const FIT_LIMITS = { parameters: 60, iterations: 2000, restarts: 8, weights: 100, bandOffset: 500 } as const;

const finite = z.number().refine(Number.isFinite, "must be a finite number");
/** JSON has no ±Infinity: an open side of a bound is null. */
const bound = finite.nullable().default(null);

export const fitParameterSchema = z
  .object({ key: z.string().min(1).max(200), lower: bound, upper: bound })
  .refine((p) => p.lower === null || p.upper === null || p.lower <= p.upper, { message: "lower bound is above the upper bound", path: ["upper"] });

export const fitSpecSchema = z.object({
  referenceSetId: z.uuid("Choose a reference band set."),
  parameters: z
    .array(fitParameterSchema)
    .min(1, "Choose at least one parameter to fit.")
    .max(FIT_LIMITS.parameters, `At most ${FIT_LIMITS.parameters} free parameters.`)
    .refine((ps) => new Set(ps.map((p) => p.key)).size === ps.length, "A parameter is listed twice."),
  /** Model band n ↔ reference band n + bandOffset. */
  bandOffset: z.number().int().min(-FIT_LIMITS.bandOffset).max(FIT_LIMITS.bandOffset).default(0),
  /** On the aligned reference energies, eV; null = every energy. */
  window: z
    .tuple([finite, finite])
    .nullable()
    .default(null)
    .refine((w) => !w || w[0] < w[1], "The window's lower edge must be below its upper edge."),
  alignment: z.enum(["none", "vbm", "least-squares"]).default("none"),
  /** Weight per reference band index (0-based); bands not listed weigh 1. */
  bandWeights: z.array(z.object({ band: z.number().int().min(0), weight: finite.pipe(z.number().min(0, "weights must be ≥ 0")) })).max(FIT_LIMITS.weights).default([]),
  /** Weight for the reference points whose position along the path (1/Å) lies in [from, to]; overlapping regions multiply. */
  regionWeights: z
    .array(
      z
        .object({ from: finite, to: finite, weight: finite.pipe(z.number().min(0, "weights must be ≥ 0")) })
        .refine((r) => r.from <= r.to, { message: "a region must start before it ends", path: ["to"] }),
    )
    .max(FIT_LIMITS.weights)
    .default([]),
  maxIterations: z.number().int().min(1).max(FIT_LIMITS.iterations).default(200),
  /** Extra seeded starts; 0 = the revision's values only. */
  restarts: z.number().int().min(0).max(FIT_LIMITS.restarts).default(0),
  seed: z.number().int().min(0).max(2 ** 31 - 1).default(1),
});

export type FitSpecInput = z.input<typeof fitSpecSchema>;
export type FitSpec = z.output<typeof fitSpecSchema>;
