"use server";

import { requestResetInput, resetPasswordInput } from "@/lib/accounts/schemas";
import { requestPasswordReset, resetPassword } from "@/lib/accounts/service";
import { headers } from "next/headers";
import { defineAction } from "@/lib/action";
import { clientIp } from "@/lib/auth/client-ip";

export const requestResetAction = defineAction({
  access: "public",
  schema: requestResetInput,
  run: async ({ email }) => {
    await requestPasswordReset(email, clientIp(await headers()));
    return { email };
  },
});

export const resetPasswordAction = defineAction({
  access: "public",
  schema: resetPasswordInput,
  run: async (input) => {
    await resetPassword(input);
    return null;
  },
});
