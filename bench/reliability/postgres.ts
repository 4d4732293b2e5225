import { execFile } from "node:child_process";
import { promisify } from "node:util";
import pg from "pg";
import { reliabilitySettings } from "./settings";

const run = promisify(execFile);

/** pg_ctl on the harness's own cluster, as the postgres user when running as root (as scripts/lib.sh does). */
async function pgCtl(args: string[]): Promise<void> {
  const { PGBIN, RELIABILITY_PG_DATA } = reliabilitySettings();
  const command = [`${PGBIN}/pg_ctl`, "-D", RELIABILITY_PG_DATA, ...args];
  const [file, ...rest] = process.getuid?.() === 0 ? ["runuser", "-u", "postgres", "--", ...command] : command;
  await run(file, rest, { cwd: "/", timeout: 120_000 });
}

export function stopPostgres(): Promise<void> {
  return pgCtl(["-m", "fast", "-w", "-t", "60", "stop"]);
}

/** Started with the options scripts/lib.sh pg_up uses. */
export function startPostgres(): Promise<void> {
  const { RELIABILITY_PG_DATA, RELIABILITY_PG_PORT } = reliabilitySettings();
  return pgCtl([
    "-l",
    `${RELIABILITY_PG_DATA}/server.log`,
    "-w",
    "-t",
    "60",
    "-o",
    `-p ${RELIABILITY_PG_PORT} -c listen_addresses=127.0.0.1 -c unix_socket_directories='' -c fsync=off`,
    "start",
  ]);
}

/** One fresh connection and `select 1`; false on any failure. */
export async function postgresAnswers(): Promise<boolean> {
  const client = new pg.Client({ connectionString: reliabilitySettings().DATABASE_URL, connectionTimeoutMillis: 2000 });
  client.on("error", () => undefined);
  try {
    await client.connect();
    await client.query("select 1");
    return true;
  } catch {
    return false;
  } finally {
    await client.end().catch(() => undefined);
  }
}
