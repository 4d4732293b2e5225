import { stopJobQueue } from "@/lib/jobs/boss";
import { releaseAccepted } from "@/tests/integration/registry-world";
import { errorHint } from "./error-hint";
import { countBy, runLoad, statusLabel, type Sample } from "./http-load";
import { releaseEventId, tallyFanOut } from "./job-states";
import { LOAD_CLIENTS } from "./load-phase";
import { postgresAnswers, startPostgres, stopPostgres } from "./postgres";
import { heading, say, seconds, type GoalRow } from "./report";
import type { Rig } from "./rig";
import { reliabilitySettings } from "./settings";
import { pause, pollUntil, waitUntil } from "./wait";

/** The web must answer well again this soon after PostgreSQL accepts connections (issue 11). */
const RECOVERY_GOAL_MS = 5000;
/** A request open longer than this counts as hung. */
const HUNG_MS = 10_000;
/** Load kept up after the first good answer, to see whether errors linger. */
const AFTER_MS = 5000;

/**
 * Figure 2 (c): the load of figure 1 (with a token whose limit is raised, so every good answer is a 200) while
 * PostgreSQL is stopped (fast shutdown), kept down a few seconds and started again.
 */
export async function runPostgresRestart(rig: Rig): Promise<GoalRow[]> {
  const { RELIABILITY_PG_DOWN_SECONDS, RELIABILITY_RECOVERY_SECONDS, RELIABILITY_WEB_PORT } = reliabilitySettings();
  heading(`Fault: PostgreSQL restart (down ${RELIABILITY_PG_DOWN_SECONDS} s) under ${LOAD_CLIENTS} keep-alive clients on GET ${rig.world.documentPath}`);
  await stopJobQueue(); // the harness's own queue connection; it reconnects on next use

  const samples: Sample[] = [];
  let stopLoad = false;
  const load = runLoad(
    { port: RELIABILITY_WEB_PORT, path: rig.world.documentPath, headers: { authorization: `Bearer ${rig.world.tokens.wide}` }, clients: LOAD_CLIENTS, stop: () => stopLoad, abandonMs: 30_000 },
    (s) => samples.push(s),
  );
  await waitUntil("200 good answers before the restart", () => samples.filter((s) => s.status === 200).length >= 200, 120);

  const marks = { web: rig.web.mark(), worker: rig.worker.mark() };
  const stopping = performance.now();
  await stopPostgres();
  const down = performance.now();
  say(`PostgreSQL stopped (fast shutdown took ${seconds(down - stopping)})`);
  await pause(RELIABILITY_PG_DOWN_SECONDS * 1000);
  await startPostgres();
  const back = await waitUntil("PostgreSQL to accept connections again", async () => ((await postgresAnswers()) ? performance.now() : null), 120);
  say(`PostgreSQL answers again ${seconds(back - down)} after it stopped`);
  const good = await pollUntil(() => samples.find((s) => s.status === 200 && s.done > back)?.done, 120, 20);
  const settleFrom = good ?? performance.now();
  await pollUntil(() => performance.now() > settleFrom + AFTER_MS, 60, 100);
  stopLoad = true;
  await load;

  const during = samples.filter((s) => s.done >= stopping && (good === null || s.done <= good));
  const after = samples.filter((s) => good !== null && s.done > good);
  const longest = samples.reduce((m, s) => Math.max(m, s.done - s.sent), 0);
  const hung = samples.filter((s) => s.done - s.sent > HUNG_MS);
  const abandoned = samples.filter((s) => s.error?.startsWith("no answer"));
  const recovery = good === null ? null : good - back;
  say(`answers from the stop to the first good one: ${[...countBy(during, statusLabel)].map(([k, v]) => `${v} × ${k}`).join(", ") || "none"}`);
  say(recovery === null ? "NO good answer within 120 s of PostgreSQL's return" : `first 200 after PostgreSQL's return: ${seconds(recovery)}`);
  say(`after that (${AFTER_MS / 1000} s more): ${[...countBy(after, statusLabel)].map(([k, v]) => `${v} × ${k}`).join(", ") || "none"}`);
  say(`longest request ${seconds(longest)}; ${hung.length} over ${HUNG_MS / 1000} s; ${abandoned.length} with no answer after 30 s`);

  const webAlive = rig.web.alive;
  const workerAlive = rig.worker.alive;
  const exited = (p: typeof rig.web, mark: number) => `EXITED (code ${p.exit?.code}, signal ${p.exit?.signal}: ${errorHint(p.outputSince(mark)) ?? "no error printed"})`;
  say(`after the restart: web process ${webAlive ? "running" : exited(rig.web, marks.web)}, worker ${workerAlive ? "running" : exited(rig.worker, marks.worker)}`);

  // The worker must still take jobs: a release now must reach every subscriber.
  const scene = rig.world.scenes.restart;
  let hooks = "not tried (worker exited)";
  let hooksOk = false;
  if (workerAlive) {
    const releasedAt = performance.now();
    const { releaseId } = await releaseAccepted(scene.board, scene.proposalId, "1.1.0");
    const eventId = await releaseEventId(releaseId);
    const done = await pollUntil(async () => {
      const t = await tallyFanOut(eventId, scene.subscriptionIds, rig.receiver);
      return t.delivered === t.subscriptions ? t : null;
    }, RELIABILITY_RECOVERY_SECONDS, 500);
    const t = done ?? (await tallyFanOut(eventId, scene.subscriptionIds, rig.receiver));
    hooksOk = done !== null;
    hooks = `${t.delivered}/${t.subscriptions} webhooks of a release made after the restart delivered${done ? ` in ${seconds(performance.now() - releasedAt)}` : ` (not within ${RELIABILITY_RECOVERY_SECONDS} s)`}`;
    say(hooks);
  }
  const afterErrors = after.filter((s) => s.status !== 200).length;
  return [
    {
      figure: "PG restart",
      goal: "web answers 200 again ≤ 5 s after PostgreSQL is back",
      measured: recovery === null ? "no good answer within 120 s" : `${seconds(recovery)}${afterErrors ? `, then ${afterErrors} non-200 answers` : ""}`,
      pass: recovery !== null && recovery <= RECOVERY_GOAL_MS && afterErrors === 0,
    },
    {
      figure: "PG restart",
      goal: "no request hung (every answer within 10 s)",
      measured: `longest ${seconds(longest)}, ${hung.length} over 10 s, ${abandoned.length} unanswered`,
      pass: hung.length === 0 && abandoned.length === 0,
    },
    {
      figure: "PG restart",
      goal: "web and worker survive; worker takes new jobs",
      measured: `web ${webAlive ? "up" : "exited"}, worker ${workerAlive ? "up" : "exited"}; ${hooks}`,
      pass: webAlive && workerAlive && hooksOk,
    },
  ];
}
