import "server-only";
import { desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { modelFamilies, releases } from "@/db/schema";

const summaryColumns = {
  id: modelFamilies.id,
  slug: modelFamilies.slug,
  title: modelFamilies.title,
  description: modelFamilies.description,
  dimension: modelFamilies.dimension,
  isDemo: modelFamilies.isDemo,
};

export function listFamilies() {
  return db.select(summaryColumns).from(modelFamilies).orderBy(modelFamilies.dimension, modelFamilies.title);
}

/** The newest release's document, or the family's starting document while it has none. */
export async function getCurrentFamilyDocument(familyId: string, startingDocument: unknown) {
  const [latest] = await db
    .select({ version: releases.version, document: releases.document })
    .from(releases)
    .where(eq(releases.familyId, familyId))
    .orderBy(desc(releases.createdAt))
    .limit(1);
  return latest ? { label: `release ${latest.version}`, document: latest.document } : startingDocument ? { label: "starting parameter set", document: startingDocument } : null;
}

export async function getFamilyBySlug(slug: string) {
  const [row] = await db
    .select({ ...summaryColumns, startingDocument: modelFamilies.startingDocument, createdAt: modelFamilies.createdAt })
    .from(modelFamilies)
    .where(eq(modelFamilies.slug, slug));
  return row ?? null;
}
