import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { familyCurators, modelFamilies } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import type { SessionUser } from "@/lib/auth/session-user";
import { AppError } from "@/lib/errors";
import type { CreateFamilyInput } from "./schemas";

/** A curator opens a new model family and becomes its first curator; its first proposal starts from a blank model. */
export async function createFamily(actor: SessionUser, input: CreateFamilyInput): Promise<{ slug: string }> {
  if (!actor.roles.includes("curator")) throw new AppError("forbidden:role", "Only curators open model families.");
  return db.transaction(async (tx) => {
    const [taken] = await tx.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, input.slug));
    if (taken) throw new AppError("conflict:slug", "A family with that slug exists already.", { slug: ["Already taken."] });
    const [row] = await tx
      .insert(modelFamilies)
      .values({ ...input, createdBy: actor.id })
      .returning({ id: modelFamilies.id });
    await tx.insert(familyCurators).values({ familyId: row.id, userId: actor.id });
    await recordAudit(tx, { actorId: actor.id, action: "family.created", subjectType: "model-family", subjectId: row.id, after: { ...input } });
    return { slug: input.slug };
  });
}
