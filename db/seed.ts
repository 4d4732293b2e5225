import { readFileSync, readdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { count, eq, inArray } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/secrets";
import { recordAudit } from "@/lib/audit";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument } from "@/lib/tb/document";
import { closeDb, db } from "./client";
import { DEMO_FAMILIES, DEMO_PEOPLE } from "./seed/demo";
import { seedDemoProposals } from "./seed/demo-proposals";
import { familyCurators, modelFamilies, proposals, releases, users } from "./schema";

/**
 * Seeds the invented demo scenario once: the fictional Meridian Nanoelectronics Group, three model families with a
 * first release each, and proposals in every stage. Re-running changes nothing that already exists.
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
    const raw = documents.get(documentFile);
    if (!raw) throw new Error(`demo model document db/seed/models/${documentFile}.json is missing`);
    const document = parseModelDocument(raw);
    const [row] = await tx
      .insert(modelFamilies)
      .values({ ...family, isDemo: true, startingDocument: document, createdBy: curator.id })
      .returning({ id: modelFamilies.id });
    await tx.insert(familyCurators).values({ familyId: row.id, userId: curator.id });
    await tx.insert(releases).values({
      familyId: row.id,
      version: "1.0.0",
      document,
      sha256: documentHash(document),
      physicsHash: physicsHash(document),
      changelog: "First demo release (invented values).",
      releasedBy: curator.id,
    });
    await recordAudit(tx, { actorId: null, action: "demo.family-seeded", subjectType: "model-family", subjectId: row.id, after: { slug: family.slug, release: "1.0.0" } });
    created++;
  }
});

const demoFamilies = await db.select({ id: modelFamilies.id, slug: modelFamilies.slug }).from(modelFamilies).where(eq(modelFamilies.isDemo, true));
const [{ n }] = await db.select({ n: count() }).from(proposals).where(inArray(proposals.familyId, demoFamilies.map((f) => f.id)));
if (n === 0 && demoFamilies.length > 0) created += await seedDemoProposals(demoFamilies);

console.log(created > 0 ? `[bandgate] demo data seeded (${created} records)` : "[bandgate] demo data already present");
await closeDb();
