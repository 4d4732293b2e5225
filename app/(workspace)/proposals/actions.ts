"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { uploadReferenceBands } from "@/board/reference-upload";
import { assignInput, createProposalInput, saveRevisionInput, verdictInput, waiveInput } from "@/board/schemas";
import { assignReviewer, createProposal, giveVerdict, saveRevision, unassignReviewer, waiveChecks } from "@/board/service";
import { defineAction } from "@/lib/action";
import { AppError } from "@/lib/errors";

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

const referenceForm = z.object({
  proposalId: z.uuid(),
  name: z.string().trim().min(1, { error: "Name the reference set." }).max(200),
  method: z.string().optional(),
  functional: z.string().optional(),
  code: z.string().optional(),
  structureSource: z.string().optional(),
  alignmentNote: z.string().optional(),
});

export const uploadReferenceAction = defineAction({
  access: { roles: ["author"] },
  schema: referenceForm,
  message: "Reference bands stored.",
  run: async ({ proposalId, name, ...provenance }, user, form) => {
    const file = form.get("file");
    if (!(file instanceof File) || file.size === 0) throw new AppError("invalid:file", "Choose a CSV or JSON file.", { file: ["Choose a CSV or JSON file."] });
    const blank = (v?: string) => (v && v.trim() ? v.trim() : undefined);
    const result = await uploadReferenceBands(user!, {
      proposalId,
      name,
      fileName: file.name,
      content: await file.text(),
      provenance: Object.fromEntries(Object.entries(provenance).map(([k, v]) => [k, blank(v)]).filter(([, v]) => v !== undefined)),
    });
    refresh(proposalId);
    return result;
  },
});
