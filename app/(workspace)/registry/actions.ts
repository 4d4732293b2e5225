"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { deprecateRelease, releaseProposal, withdrawRelease } from "@/board/release";
import { defineAction } from "@/lib/action";
import { deprecateInput, followInput, releaseInput, withdrawInput } from "@/lib/registry/schemas";
import { setFollowing } from "@/lib/registry/subscription-service";

const releasePage = (slug: string, version: string) => `/registry/${encodeURIComponent(slug)}/${encodeURIComponent(version)}`;

export const releaseProposalAction = defineAction({
  access: { roles: ["curator"] },
  schema: releaseInput,
  run: async (input, user) => {
    const { familySlug, version } = await releaseProposal(user!, input);
    redirect(releasePage(familySlug, version));
  },
});

export const deprecateReleaseAction = defineAction({
  access: { roles: ["curator"] },
  schema: deprecateInput,
  message: "Deprecated. Subscribers are being told.",
  run: async (input, user) => {
    await deprecateRelease(user!, input);
    revalidatePath(releasePage(input.familySlug, input.releaseVersion));
  },
});

export const withdrawReleaseAction = defineAction({
  access: { roles: ["curator"] },
  schema: withdrawInput,
  message: "Withdrawn. Subscribers are being told.",
  run: async (input, user) => {
    await withdrawRelease(user!, input);
    revalidatePath(releasePage(input.familySlug, input.releaseVersion));
  },
});

export const followFamilyAction = defineAction({
  access: "signed-in",
  schema: followInput,
  run: async (input, user) => {
    await setFollowing(user!, input);
    revalidatePath(`/registry/${encodeURIComponent(input.familySlug)}`);
    return { following: input.follow === "yes" };
  },
});
