import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { modelFamilies } from "@/db/schema";

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

export async function getFamilyBySlug(slug: string) {
  const [row] = await db
    .select({ ...summaryColumns, startingDocument: modelFamilies.startingDocument, createdAt: modelFamilies.createdAt })
    .from(modelFamilies)
    .where(eq(modelFamilies.slug, slug));
  return row ?? null;
}
