import { readFileSync, readdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/secrets";
import { recordAudit } from "@/lib/audit";
import { closeDb, db } from "./client";
import { DEMO_FAMILIES, DEMO_PEOPLE } from "./seed/demo";
import { modelFamilies, users } from "./schema";

/**
 * Seeds the invented demo scenario once: the fictional Meridian Nanoelectronics Group and three model families.
 * Re-running changes nothing that already exists.
 */
const modelsDir = fileURLToPath(new URL("./seed/models/", import.meta.url));
const documents = new Map(
  readdirSync(modelsDir)
    .filter((f) => f.endsWith(".json"))
    .map((f) => [f.replace(/\.json$/, ""), JSON.parse(readFileSync(modelsDir + f, "utf8")) as unknown]),
);

let created = 0;
await db.transaction(async (tx) => {
  for (const person of DEMO_PEOPLE) {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, person.email));
    if (existing) continue;
    const [row] = await tx
      .insert(users)
      .values({ email: person.email, name: person.name, roles: person.roles, passwordHash: await hashPassword(person.password) })
      .returning({ id: users.id });
    await recordAudit(tx, { actorId: null, action: "demo.user-seeded", subjectType: "user", subjectId: row.id, after: { email: person.email, roles: person.roles } });
    created++;
  }
  const [curator] = await tx.select({ id: users.id }).from(users).where(eq(users.email, "akira.sato@meridian.example"));
  for (const { documentFile, ...family } of DEMO_FAMILIES) {
    const [existing] = await tx.select({ id: modelFamilies.id }).from(modelFamilies).where(eq(modelFamilies.slug, family.slug));
    if (existing) continue;
    const document = documents.get(documentFile);
    if (!document) throw new Error(`demo model document db/seed/models/${documentFile}.json is missing`);
    const [row] = await tx
      .insert(modelFamilies)
      .values({ ...family, isDemo: true, startingDocument: document, createdBy: curator?.id ?? null })
      .returning({ id: modelFamilies.id });
    await recordAudit(tx, { actorId: null, action: "demo.family-seeded", subjectType: "model-family", subjectId: row.id, after: { slug: family.slug } });
    created++;
  }
});
console.log(created > 0 ? `[bandgate] demo data seeded (${created} records)` : "[bandgate] demo data already present");
await closeDb();
