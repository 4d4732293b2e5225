import type { Pool } from "pg";
import { closeDb } from "@/db/client";
import { stopJobQueue } from "@/lib/jobs/boss";
import { HttpSession } from "@/tests/support/http-session";
import { runBadInput } from "./bad-input/phase";
import { runLoadFigure } from "./load-phase";
import { runPostgresRestart } from "./postgres-restart";
import { startWeb, startWorker, stopAll } from "./processes";
import { WebhookReceiver } from "./receiver";
import { heading, printSummary, say, seconds, type GoalRow } from "./report";
import type { Rig } from "./rig";
import { reliabilitySettings } from "./settings";
import { runWorkerFault } from "./worker-faults";
import { seedWorld } from "./world";

/*
 * npm run reliability: the figures of issue 11 (load, faults, bad input) against a production build, its worker and
 * its own PostgreSQL, which scripts/reliability.sh prepares. Goals not met are reported, not thrown: the exit code
 * is non-zero only when the harness itself could not measure something.
 */
const settings = reliabilitySettings();
const rows: GoalRow[] = [];
let harnessFailed = false;

// The harness's own pool loses its idle connections when PostgreSQL restarts on purpose; without a listener that
// error event would end this process.
(globalThis as unknown as { bandgatePool?: Pool }).bandgatePool?.on("error", () => undefined);

const interrupted = async () => {
  await stopAll();
  process.exit(130);
};
process.on("SIGINT", interrupted);
process.on("SIGTERM", interrupted);

async function phase(figure: string, run: () => Promise<GoalRow[]>): Promise<void> {
  try {
    rows.push(...(await run()));
  } catch (err) {
    harnessFailed = true;
    const message = err instanceof Error ? err.message : String(err);
    say(`HARNESS ERROR: ${message}`);
    if (err instanceof Error && err.stack) console.error(err.stack);
    rows.push({ figure, goal: "(the harness could not measure this figure)", measured: message, pass: null });
  }
}

async function signedIn(person: { email: string; password: string }): Promise<HttpSession> {
  const session = new HttpSession(settings.baseUrl);
  const error = await session.signIn(person.email, person.password);
  if (error) throw new Error(`sign-in of ${person.email} failed: ${error}`);
  return session;
}

const receiver = new WebhookReceiver(200);
const started = performance.now();
try {
  heading("Set-up");
  await receiver.listen(settings.RELIABILITY_HOOK_PORT);
  const world = await seedWorld(`http://127.0.0.1:${receiver.port}`);
  say(`seeded: families, proposals, API tokens, ${Object.keys(world.scenes).length} × ${world.scenes.kill.subscriptionIds.length} webhook subscribers (receiver on 127.0.0.1:${receiver.port})`);
  const web = await startWeb();
  const worker = await startWorker();
  say(`next start on ${settings.baseUrl} (pid ${web.pid}), worker (pid ${worker.pid}), PostgreSQL on 127.0.0.1:${settings.RELIABILITY_PG_PORT}`);
  const rig: Rig = { web, worker, receiver, world, author: await signedIn(world.board.author), fitAuthor: await signedIn(world.fit.world.author) };

  await phase("Load", () => runLoadFigure(world.documentPath, world.tokens.load));
  await phase("Bad input", () => runBadInput(rig));
  await phase("Fault SIGKILL", () => runWorkerFault(rig, "SIGKILL", world.fit.runs[0], world.scenes.kill));
  await phase("Fault SIGTERM", () => runWorkerFault(rig, "SIGTERM", world.fit.runs[1], world.scenes.term));
  await phase("PG restart", () => runPostgresRestart(rig));
} catch (err) {
  harnessFailed = true;
  say(`HARNESS ERROR during set-up: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
} finally {
  await stopAll();
  await receiver.close();
  await stopJobQueue().catch(() => undefined);
  await closeDb().catch(() => undefined);
}
printSummary(rows);
say(`(${seconds(performance.now() - started)} in all; logs of the app and the worker in ${settings.RELIABILITY_RUN_DIR})`);
process.exit(harnessFailed ? 1 : 0);
