"use server";

import { changePasswordInput } from "@/lib/accounts/schemas";
import { changeOwnPassword } from "@/lib/accounts/service";
import { defineAction } from "@/lib/action";

export const changePasswordAction = defineAction({
  access: "signed-in",
  schema: changePasswordInput,
  message: "Password changed.",
  run: async (input, user) => {
    await changeOwnPassword(user!, input);
    return null;
  },
});
