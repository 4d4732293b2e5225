import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

/** Inputs shared by forms, server actions and route handlers. */

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address." }).max(254, { error: "That e-mail address is too long." }));

export const passwordSchema = z
  .string({ error: "Enter a password." })
  .min(10, { error: "Use at least 10 characters." })
  .max(200, { error: "Use at most 200 characters." });

const roleList = z.preprocess(
  (v) => (v === undefined || v === null || v === "" ? [] : Array.isArray(v) ? v : [v]),
  z.array(z.enum(ROLES, { error: "Unknown role." })),
);

export const personNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(1, { error: "Enter a name." })
  .max(120, { error: "Use at most 120 characters." });

export const inviteInput = z.object({
  email: emailSchema,
  name: personNameSchema,
  roles: roleList.pipe(z.array(z.enum(ROLES)).min(1, { error: "Choose at least one role." })),
});
export type InviteInput = z.infer<typeof inviteInput>;

const versionField = z.coerce.number({ error: "Missing version." }).int().min(1);

export const changeRolesInput = z.object({
  userId: z.uuid({ error: "Unknown person." }),
  roles: roleList,
  version: versionField,
});
export type ChangeRolesInput = z.infer<typeof changeRolesInput>;

export const setActiveInput = z.object({
  userId: z.uuid({ error: "Unknown person." }),
  active: z.preprocess((v) => v === true || v === "true", z.boolean()),
  version: versionField,
});
export type SetActiveInput = z.infer<typeof setActiveInput>;

const tokenField = z.string({ error: "The link is incomplete." }).min(20, { error: "The link is incomplete." }).max(200);

export const acceptInvitationInput = z
  .object({ token: tokenField, password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInput>;

export const requestResetInput = z.object({ email: emailSchema });

export const resetPasswordInput = z
  .object({ token: tokenField, password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });
export type ResetPasswordInput = z.infer<typeof resetPasswordInput>;

export const changePasswordInput = z
  .object({ current: z.string().min(1, { error: "Enter your current password." }), password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });
export type ChangePasswordInput = z.infer<typeof changePasswordInput>;

export const signInInput = z.object({
  email: emailSchema,
  password: z.string().min(1, { error: "Enter your password." }).max(200),
});
