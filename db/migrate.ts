import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { closeDb, db } from "./client";

const migrationsFolder = fileURLToPath(new URL("./migrations", import.meta.url));

await migrate(db, { migrationsFolder });
console.log("[bandgate] database migrated");
await closeDb();
