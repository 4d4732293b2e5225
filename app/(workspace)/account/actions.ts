"use server";

import { changePasswordInput } from "@/lib/accounts/schemas";
import { changeOwnPassword } from "@/lib/accounts/service";
import { defineAction } from "@/lib/action";
import { renewOwnSession } from "@/lib/auth/session-cookie";

export const changePasswordAction = defineAction({
  access: "signed-in",
  schema: changePasswordInput,
  message: "Password changed. Every other session of your account has ended.",
  run: async (input, user) => {
    const { sessionVersion } = await changeOwnPassword(user!, input);
    await renewOwnSession(sessionVersion);
    return null;
  },
});
