import { fileURLToPath } from "node:url";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";
import PgBoss from "pg-boss";
import { serverEnv } from "@/lib/env";
import { ensureQueues, JOB_SCHEMA } from "@/lib/jobs/queues";
import { appRoleProblem, describeRole, grantAppRole } from "./app-role-grants";

/**
 * The migration step, run as the owner role (MIGRATION_DATABASE_URL; DATABASE_URL when unset): the schema, then the
 * job queue's own schema and queues (pg-boss installs and upgrades them when it starts, and creates a table per queue,
 * which the app role may not do), then row access for the app role of DATABASE_URL.
 */
const env = serverEnv();
const ownerUrl = env.MIGRATION_DATABASE_URL ?? env.DATABASE_URL;
const migrationsFolder = fileURLToPath(new URL("./migrations", import.meta.url));

const pool = new pg.Pool({ connectionString: ownerUrl, max: 2 });
await migrate(drizzle(pool), { migrationsFolder });

const boss = new PgBoss({ connectionString: ownerUrl, schema: JOB_SCHEMA, max: 2, supervise: false, schedule: false });
boss.on("error", (err) => console.error("[bandgate] job queue", err.message));
await boss.start();
await ensureQueues(boss);
await boss.stop({ graceful: false, wait: true });

const app = new pg.Client({ connectionString: env.DATABASE_URL });
await app.connect();
const appRole = (await app.query<{ u: string }>("select current_user as u")).rows[0].u;
await app.end();

const owner = await pool.connect();
try {
  const ownerRole = (await owner.query<{ u: string }>("select current_user as u")).rows[0].u;
  if (appRole !== ownerRole) {
    await grantAppRole(owner, appRole, JOB_SCHEMA);
    console.log(`[bandgate] ${appRole} has row access to the tables of ${ownerRole}`);
  }
  const facts = await describeRole(owner, appRole, JOB_SCHEMA);
  const problem = facts ? appRoleProblem(facts) : `role ${appRole} was not found`;
  if (problem) {
    console.warn(`[bandgate] warning: DATABASE_URL connects as ${appRole}, unfit for the app: ${problem}.`);
    console.warn("[bandgate] Releases and the audit trail then rest on trust; give the app its own role (README: Database roles).");
  }
} finally {
  owner.release();
}
console.log("[bandgate] database migrated");
await pool.end();
