"use server";

import { revalidatePath } from "next/cache";
import { changeRolesInput, inviteInput, setActiveInput } from "@/lib/accounts/schemas";
import { changeRoles, inviteUser, setActive } from "@/lib/accounts/service";
import { defineAction } from "@/lib/action";
import { renewOwnSession } from "@/lib/auth/session-cookie";

const admins = { roles: ["admin" as const] };

export const inviteAction = defineAction({
  access: admins,
  schema: inviteInput,
  message: "Invitation sent.",
  run: async (input, user) => {
    const result = await inviteUser(user!, input);
    revalidatePath("/admin/people");
    return result;
  },
});

export const changeRolesAction = defineAction({
  access: admins,
  schema: changeRolesInput,
  message: "Roles saved.",
  run: async (input, user) => {
    const { sessionVersion } = await changeRoles(user!, input);
    if (input.userId === user!.id) await renewOwnSession(sessionVersion);
    revalidatePath("/admin/people");
    return null;
  },
});

export const setActiveAction = defineAction({
  access: admins,
  schema: setActiveInput,
  run: async (input, user) => {
    await setActive(user!, input);
    revalidatePath("/admin/people");
    return null;
  },
});
