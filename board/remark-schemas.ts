import { z } from "zod";
import { withoutNul } from "@/lib/pg-text";
import { REMARK_MAX, remarkAnchorSchema } from "./remark-rules";

const body = withoutNul(z.string({ error: "Write the remark." }))
  .trim()
  .min(1, { error: "Write the remark." })
  .max(REMARK_MAX, { error: `Use at most ${REMARK_MAX.toLocaleString("en")} characters.` });

const anchorText = z
  .string()
  .default('{"kind":"proposal"}')
  .transform((text, ctx) => {
    try {
      return remarkAnchorSchema.parse(JSON.parse(text));
    } catch {
      ctx.addIssue({ code: "custom", message: "Unknown anchor for the remark." });
      return z.NEVER;
    }
  });

export const createRemarkInput = z.object({
  proposalId: z.uuid({ error: "Unknown proposal." }),
  body,
  blocking: z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean()).default(false),
  anchor: z.union([remarkAnchorSchema, anchorText]),
  parentId: z.preprocess((v) => (v === "" ? undefined : v), z.uuid().optional()),
});
export type CreateRemarkInput = z.infer<typeof createRemarkInput>;

export const remarkActionInput = z.object({
  remarkId: z.uuid({ error: "Unknown remark." }),
  version: z.coerce.number().int().min(1),
  action: z.enum(["address", "resolve", "reopen"], { error: "Unknown action." }),
});
export type RemarkActionInput = z.infer<typeof remarkActionInput>;

export const editRemarkInput = z.object({
  remarkId: z.uuid({ error: "Unknown remark." }),
  version: z.coerce.number().int().min(1),
  body,
});
export type EditRemarkInput = z.infer<typeof editRemarkInput>;
