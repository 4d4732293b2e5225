import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { serverEnv } from "@/lib/env";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the pool or a transaction: queries that may run inside one take this. */
export type Conn = Database | Tx;

const cache = globalThis as unknown as { bandgatePool?: Pool; bandgateDb?: Database };

function createDb(): Database {
  const pool = new Pool({ connectionString: serverEnv().DATABASE_URL, max: 10 });
  // An idle connection dropped by the server (a restart, an administrator) is replaced on the next query; without a
  // listener the pool's "error" event would end the process.
  pool.on("error", (err) => console.error(`[bandgate] database connection lost: ${err.message}`));
  cache.bandgatePool = pool;
  return drizzle(pool, { schema });
}

/** One pool per process (kept on globalThis so dev reloads do not open new pools). */
export const db: Database = cache.bandgateDb ?? (cache.bandgateDb = createDb());

export async function closeDb(): Promise<void> {
  await cache.bandgatePool?.end();
  cache.bandgatePool = undefined;
  cache.bandgateDb = undefined;
}
