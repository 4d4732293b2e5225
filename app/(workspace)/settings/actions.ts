"use server";

import { revalidatePath } from "next/cache";
import { defineAction } from "@/lib/action";
import { revokeTokenInput, subscriptionIdInput, tokenInput, webhookInput } from "@/lib/registry/schemas";
import { addWebhook, removeWebhook } from "@/lib/registry/subscription-service";
import { createApiToken, revokeApiToken } from "@/lib/registry/token-service";

export const createTokenAction = defineAction({
  access: "signed-in",
  schema: tokenInput,
  run: async (input, user) => {
    const created = await createApiToken(user!, input);
    revalidatePath("/settings/tokens");
    return { name: input.name, token: created.token };
  },
});

export const revokeTokenAction = defineAction({
  access: "signed-in",
  schema: revokeTokenInput,
  message: "Revoked.",
  run: async (input, user) => {
    await revokeApiToken(user!, input);
    revalidatePath("/settings/tokens");
  },
});

export const addWebhookAction = defineAction({
  access: "signed-in",
  schema: webhookInput,
  message: "Webhook added. Every release, deprecation and withdrawal of the family is posted to it.",
  run: async (input, user) => {
    await addWebhook(user!, input);
    revalidatePath("/settings/notifications");
  },
});

export const removeWebhookAction = defineAction({
  access: "signed-in",
  schema: subscriptionIdInput,
  message: "Removed.",
  run: async (input, user) => {
    await removeWebhook(user!, input);
    revalidatePath("/settings/notifications");
  },
});
