"use server";

import { acceptInvitationInput } from "@/lib/accounts/schemas";
import { acceptInvitation } from "@/lib/accounts/service";
import { defineAction } from "@/lib/action";

export const acceptInvitationAction = defineAction({
  access: "public",
  schema: acceptInvitationInput,
  run: async (input) => {
    const { email } = await acceptInvitation(input);
    return { email };
  },
});
