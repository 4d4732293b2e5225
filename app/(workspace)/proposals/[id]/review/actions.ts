"use server";

import { revalidatePath } from "next/cache";
import { createRemarkInput } from "@/board/remark-schemas";
import { createRemark } from "@/board/remarks";
import { defineAction } from "@/lib/action";

export const createRemarkAction = defineAction({
  access: "signed-in",
  schema: createRemarkInput,
  message: "Remark posted.",
  run: async (input, user) => {
    const result = await createRemark(user!, input);
    revalidatePath(`/proposals/${input.proposalId}/review`);
    return result;
  },
});
