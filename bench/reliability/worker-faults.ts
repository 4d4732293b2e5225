import { FINAL_FIT_STATUSES } from "@/lib/fits/record";
import { DIAMOND_KEYS, fitRow, startFitOverHttp } from "@/tests/integration/fit-world";
import { releaseAccepted } from "@/tests/integration/registry-world";
import { describeStates, jobStates, releaseEventId, tallyFanOut, unfinishedJobs } from "./job-states";
import { startWorker } from "./processes";
import { heading, say, seconds, type GoalRow } from "./report";
import type { Rig } from "./rig";
import { reliabilitySettings } from "./settings";
import { pollUntil, waitUntil, within } from "./wait";
import type { ReleaseScene } from "./world";

/** Several seeded starts of the sp3s* refit, so it runs long enough to be interrupted and to finish afterwards. */
const FIT_RESTARTS = 5;
/** Deliveries answered before the signal: the fan-out has begun and has most of its subscribers still ahead. */
const DELIVERIES_BEFORE_SIGNAL = 3;

/**
 * Figure 2 (a, b): the worker gets `signal` while it runs a refit and fans a release out to webhook subscribers; it is
 * started again, and every job must end: the refit with a result, each subscription with its one delivery.
 */
export async function runWorkerFault(rig: Rig, signal: "SIGKILL" | "SIGTERM", run: { proposalId: string; referenceId: string }, scene: ReleaseScene): Promise<GoalRow[]> {
  heading(`Fault: ${signal} of the worker during a refit and a webhook fan-out (${scene.subscriptionIds.length} subscribers)`);
  const fitId = await startFitOverHttp(rig.fitAuthor, run.proposalId, {
    referenceSetId: run.referenceId,
    parameters: DIAMOND_KEYS.map((key) => ({ key })),
    restarts: FIT_RESTARTS,
    seed: 4,
  });
  await waitUntil("the refit to run", async () => {
    const row = await fitRow(fitId);
    return row.status === "running" && row.iteration >= 1;
  }, 240);
  const { releaseId } = await releaseAccepted(scene.board, scene.proposalId, "1.1.0");
  const eventId = await releaseEventId(releaseId);
  await waitUntil(`${DELIVERIES_BEFORE_SIGNAL} webhook deliveries`, () => rig.receiver.forEvent(eventId).length >= DELIVERIES_BEFORE_SIGNAL, 180);
  // The signal lands while a delivery is in flight: the subscriber has the POST and has not answered yet.
  const inFlight = await within(rig.receiver.nextArrival(eventId), 60);
  if (inFlight === null) throw new Error("no webhook delivery arrived within 60 s to signal the worker during");

  const before = await fitRow(fitId);
  const receivedBefore = rig.receiver.forEvent(eventId).length;
  const signalled = performance.now();
  rig.worker.signal(signal);
  const exit = await within(rig.worker.exited, 90);
  if (!exit) {
    say(`the worker had not exited 90 s after ${signal}; killed`);
    rig.worker.signal("SIGKILL");
    await rig.worker.exited;
  } else {
    say(`worker exited ${seconds(exit.at - signalled)} after ${signal} (code ${exit.code}, signal ${exit.signal}); at that moment the refit was ${before.status} at iteration ${before.iteration} (attempt ${before.attempts}) and ${receivedBefore} of ${scene.subscriptionIds.length} deliveries were answered, one more in flight`);
  }
  const fitWasRunning = before.status === "running";

  rig.worker = await startWorker();
  const restarted = performance.now();
  const { RELIABILITY_RECOVERY_SECONDS } = reliabilitySettings();
  // Each part's own finishing time, and the moment everything (pg-boss's record included) was done.
  let fitDone: number | null = null;
  let hooksDone: number | null = null;
  const settled = await pollUntil(async () => {
    const row = await fitRow(fitId);
    const tally = await tallyFanOut(eventId, scene.subscriptionIds, rig.receiver);
    if (fitDone === null && FINAL_FIT_STATUSES.includes(row.status)) fitDone = performance.now() - restarted;
    if (hooksDone === null && tally.pending === 0 && tally.delivered + tally.failed === tally.subscriptions) hooksDone = performance.now() - restarted;
    if (fitDone === null || hooksDone === null) return false;
    const states = await jobStates([fitId, eventId, ...tally.deliveryIds]);
    return [...states.keys()].every((k) => /(completed|failed|cancelled)$/.test(k));
  }, RELIABILITY_RECOVERY_SECONDS, 500);
  const fit = await fitRow(fitId);
  const tally = await tallyFanOut(eventId, scene.subscriptionIds, rig.receiver);
  const states = await jobStates([fitId, eventId, ...tally.deliveryIds]);
  const after = (ms: number | null) => (ms === null ? `not within ${RELIABILITY_RECOVERY_SECONDS} s` : `${seconds(ms)} after the worker was back`);
  say(settled ? "every job of the scenario finished" : `NOT every job finished within ${RELIABILITY_RECOVERY_SECONDS} s of the worker's return (RELIABILITY_RECOVERY_SECONDS):`);
  for (const j of await unfinishedJobs([fitId, eventId, ...tally.deliveryIds])) say(`  ${j}`);
  say(`refit: ${fit.status} after ${fit.attempts} attempt(s), ${after(fitDone)}${fit.failureReason ? ` — ${fit.failureReason}` : ""}`);
  say(
    `webhooks (${after(hooksDone)}): ${tally.delivered} delivered, ${tally.failed} failed, ${tally.pending} pending of ${tally.subscriptions}; ` +
      `${tally.lost} subscriptions got nothing, ${tally.split} got two different deliveries, ${tally.duplicates} repeated POST(s) of one delivery id`,
  );
  say(`pg-boss jobs of this scenario: ${describeStates(states)}`);

  const fitFinished = fit.status === "converged" || fit.status === "not_converged";
  // A hard kill can land between the subscriber's 200 and the worker recording it: that one delivery is sent again
  // with the same Bandgate-Delivery id (at least once). A graceful stop must not repeat anything.
  const allowedRepeats = signal === "SIGKILL" ? 1 : 0;
  const hooksOk = tally.delivered === tally.subscriptions && tally.lost === 0 && tally.split === 0 && tally.duplicates <= allowedRepeats;
  const leftOver = [...states].filter(([k]) => !/ completed$/.test(k)).reduce((n, [, v]) => n + v, 0);
  return [
    {
      figure: `Fault ${signal}`,
      goal: "refit interrupted mid-run reaches a result (retried)",
      measured: fitWasRunning ? `${fit.status}, ${fit.attempts} attempt(s), ${fitDone === null ? "not finished" : `${seconds(fitDone)} after restart`}` : `refit had already ended (${before.status})`,
      pass: fitWasRunning ? fitFinished : null,
    },
    {
      figure: `Fault ${signal}`,
      goal: `each subscription: exactly one delivery of the event`,
      measured: `${tally.delivered}/${tally.subscriptions} delivered, ${tally.lost} lost, ${tally.pending} pending, ${tally.duplicates} repeated`,
      pass: hooksOk,
    },
    {
      figure: `Fault ${signal}`,
      goal: "every job finished (none left active or queued)",
      measured: leftOver ? `${leftOver} not completed: ${describeStates(new Map([...states].filter(([k]) => !/ completed$/.test(k))))}` : "all completed",
      pass: leftOver === 0,
    },
  ];
}
