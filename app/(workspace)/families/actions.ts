"use server";

import { redirect } from "next/navigation";
import { defineAction } from "@/lib/action";
import { createFamilyInput } from "@/lib/families/schemas";
import { createFamily } from "@/lib/families/service";

export const createFamilyAction = defineAction({
  access: { roles: ["curator"] },
  schema: createFamilyInput,
  run: async (input, user) => {
    const { slug } = await createFamily(user!, input);
    redirect(`/families/${slug}`);
  },
});
