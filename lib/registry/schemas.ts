import { z } from "zod";
import { withoutNul } from "@/lib/pg-text";

/** Inputs of the registry's use-cases, shared by server actions and forms. */
const reason = (what: string) => z.string({ error: `Write why ${what}.` }).trim().min(10, { error: "Write why (at least 10 characters)." }).max(2000, { error: "Use at most 2,000 characters." });

export const releaseInput = z.object({
  proposalId: z.uuid({ error: "Unknown proposal." }),
  version: z.coerce.number({ error: "Missing card version." }).int().min(1),
  releaseVersion: z.string({ error: "Give a version." }).trim().min(1, { error: "Give a version." }).max(40),
  changelog: z.string({ error: "Write a changelog." }).trim().min(10, { error: "Write a changelog (at least 10 characters)." }).max(20_000, { error: "Use at most 20,000 characters." }),
});
export type ReleaseInput = z.infer<typeof releaseInput>;

const releaseRef = { familySlug: z.string().min(1).max(200), releaseVersion: z.string().min(1).max(40) };

export const deprecateInput = z.object({
  ...releaseRef,
  reason: reason("it is deprecated"),
  successorVersion: z.string().trim().max(40).optional().transform((v) => (v ? v : undefined)),
});
export type DeprecateInput = Omit<z.infer<typeof deprecateInput>, "successorVersion"> & { successorVersion?: string };

export const withdrawInput = z.object({ ...releaseRef, reason: reason("it is withdrawn") });
export type WithdrawInput = z.infer<typeof withdrawInput>;

export const tokenInput = z.object({ name: withoutNul(z.string({ error: "Name the token." })).trim().min(2, { error: "Use at least 2 characters." }).max(80, { error: "Use at most 80 characters." }) });
export const revokeTokenInput = z.object({ tokenId: z.uuid({ error: "Unknown token." }) });

export const webhookInput = z.object({
  familySlug: z.string({ error: "Choose a family." }).min(1, { error: "Choose a family." }),
  url: z
    .url({ protocol: /^https?$/, error: "Give an http or https address." })
    .max(2000),
  secret: z.string({ error: "Give a secret." }).min(16, { error: "Use a secret of at least 16 characters." }).max(200),
});
export type WebhookInput = z.infer<typeof webhookInput>;

export const subscriptionIdInput = z.object({ subscriptionId: z.uuid({ error: "Unknown subscription." }) });
export const followInput = z.object({ familySlug: z.string().min(1), follow: z.enum(["yes", "no"]) });
