import { z } from "zod";
import type { MetricsOptions } from "./metrics";

/** ?alignment=vbm&window=-8,3 → metrics options; bad values are refused with the field named. */
export const metricsQuerySchema = z.object({
  alignment: z.enum(["none", "vbm", "fermi", "least-squares"]).default("vbm"),
  window: z
    .string()
    .optional()
    .transform((text, ctx): [number, number] | null => {
      if (text === undefined || text === "") return null;
      const parts = text.split(",").map(Number);
      if (parts.length !== 2 || !parts.every(Number.isFinite) || parts[0] >= parts[1]) {
        ctx.addIssue({ code: "custom", message: "window must be two numbers, lower first, e.g. -8,3" });
        return z.NEVER;
      }
      return [parts[0], parts[1]];
    }),
});

export function metricsQueryString(opts: MetricsOptions): string {
  const q = new URLSearchParams({ alignment: opts.alignment });
  if (opts.window) q.set("window", `${opts.window[0]},${opts.window[1]}`);
  return q.toString();
}
