"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { assignInput, createProposalInput, saveRevisionInput, verdictInput, waiveInput } from "@/board/schemas";
import { assignReviewer, createProposal, giveVerdict, saveRevision, unassignReviewer, waiveChecks } from "@/board/service";
import { defineAction } from "@/lib/action";

const refresh = (id: string) => revalidatePath(`/proposals/${id}`);

export const createProposalAction = defineAction({
  access: { roles: ["author"] },
  schema: createProposalInput,
  run: async (input, user) => {
    const { proposalId } = await createProposal(user!, input);
    redirect(`/proposals/${proposalId}`);
  },
});

export const saveRevisionAction = defineAction({
  access: { roles: ["author"] },
  schema: saveRevisionInput,
  message: "Saved as a new revision.",
  run: async (input, user) => {
    const result = await saveRevision(user!, input);
    refresh(input.proposalId);
    return result;
  },
});

export const assignReviewerAction = defineAction({
  access: { roles: ["curator"] },
  schema: assignInput,
  message: "Reviewer assigned.",
  run: async (input, user) => {
    const result = await assignReviewer(user!, input);
    refresh(input.proposalId);
    return result;
  },
});

export const unassignReviewerAction = defineAction({
  access: { roles: ["curator"] },
  schema: assignInput,
  run: async (input, user) => {
    const result = await unassignReviewer(user!, input);
    refresh(input.proposalId);
    return result;
  },
});

export const waiveChecksAction = defineAction({
  access: { roles: ["curator"] },
  schema: waiveInput,
  message: "Failing checks waived; the reason is in the audit trail.",
  run: async (input, user) => {
    const result = await waiveChecks(user!, input);
    refresh(input.proposalId);
    return result;
  },
});

export const verdictAction = defineAction({
  access: { roles: ["reviewer"] },
  schema: verdictInput,
  message: "Verdict recorded.",
  run: async (input, user) => {
    const result = await giveVerdict(user!, input);
    refresh(input.proposalId);
    return result;
  },
});
