import { z } from "zod";
import { ACCEPTANCE_CRITERIA_SCHEMA } from "@/lib/tb/analysis/acceptance";

const criteriaText = z
  .string()
  .trim()
  .default("[]")
  .transform((text, ctx) => {
    let raw: unknown;
    try {
      raw = JSON.parse(text || "[]");
    } catch {
      ctx.addIssue({ code: "custom", message: "Write the criteria as a JSON list, e.g. [{\"metric\": \"gap\", \"target\": 1.17, \"tolerance\": 0.05}]." });
      return z.NEVER;
    }
    const parsed = ACCEPTANCE_CRITERIA_SCHEMA.safeParse(raw);
    if (!parsed.success) {
      ctx.addIssue({ code: "custom", message: parsed.error.issues.map((i) => `${i.path.join(".") || "criteria"}: ${i.message}`).join("; ") });
      return z.NEVER;
    }
    return parsed.data;
  });

export const createFamilyInput = z.object({
  slug: z
    .string()
    .trim()
    .toLowerCase()
    .regex(/^[a-z0-9][a-z0-9-]{1,62}[a-z0-9]$/, { error: "Use 3–64 lower-case letters, digits and hyphens." }),
  title: z.string().trim().min(3, { error: "Use at least 3 characters." }).max(200),
  description: z.string().trim().max(5000).default(""),
  dimension: z.coerce.number().int().min(1, { error: "Dimension is 1, 2 or 3." }).max(3, { error: "Dimension is 1, 2 or 3." }),
  requiredAccepts: z.coerce.number().int().min(1, { error: "At least one accepting reviewer." }).max(10).default(2),
  acceptanceCriteria: criteriaText,
});
export type CreateFamilyInput = z.infer<typeof createFamilyInput>;
