import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";
import { versionOf } from "@/tests/support/board-fixtures";
import { startWeb } from "../processes";
import { heading, say, seconds, type GoalRow } from "../report";
import type { Rig } from "../rig";
import { reliabilitySettings } from "../settings";
import { pollUntil } from "../wait";
import type { World } from "../world";
import type { BadCase, CaseContext } from "./case";
import { documentCases, remarkCases } from "./json-body-cases";
import { queryCases } from "./query-cases";
import { sendCase, type Outcome } from "./send";
import { uploadCases } from "./upload-cases";

const SLOW_MS = 1000;
const MIN_INPUTS = 1000;

/** Pages and lists that show what the inputs stored: they must still render, and quickly. */
function storedInputViews(world: World): BadCase[] {
  const p = world.proposals;
  const view = (route: string, path: string): BadCase => ({ route, summary: "view after the inputs above were sent", auth: "author", judge: "status", build: () => ({ method: "GET", path }) });
  return [
    view("GET /proposals/:id/review (page)", `/proposals/${p.remarks}/review`),
    view("GET /api/proposals/:id/remarks", `/api/proposals/${p.remarks}/remarks`),
    view("GET /proposals/:id (page)", `/proposals/${p.revisions}`),
    view("GET /proposals/:id/review (page)", `/proposals/${p.revisions}/review`),
    view("GET /proposals/:id (page)", `/proposals/${p.uploads}`),
    view("GET /board (page)", "/board"),
    view("GET /api/board", "/api/board"),
  ];
}

/** Every generated case, in a fixed order: reads first, then writes, then the views of what was written. */
function allCases(world: World, seed: number): { cases: BadCase[]; notes: string[] } {
  const rng = seededUniform(seed);
  const notes: string[] = [];
  const cases = [...queryCases(world), ...remarkCases(world, rng), ...uploadCases(world, rng), ...documentCases(world, rng), ...storedInputViews(world)];
  return { cases, notes };
}

const line = (o: Outcome) => `${o.c.route} — ${o.c.summary} → ${o.status ?? o.error} (${seconds(o.ms)})${o.hint ? `: ${o.hint}` : ""}`;

/** Waits until the web answers its health check again (a slow request may have held its event loop). */
async function healthy(rig: Rig): Promise<boolean> {
  const { baseUrl } = reliabilitySettings();
  return (await pollUntil(() => fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(10_000) }).then((r) => r.ok, () => false), 300, 500)) === true || !rig.web.alive;
}

/** Figure 3: at least 1,000 generated malformed inputs through the real routes, signed in and with a token. */
export async function runBadInput(rig: Rig): Promise<GoalRow[]> {
  const { RELIABILITY_SEED, baseUrl } = reliabilitySettings();
  const { cases, notes } = allCases(rig.world, RELIABILITY_SEED);
  heading(`Bad input: ${cases.length} generated inputs (seed ${RELIABILITY_SEED}) through the running app, one at a time`);
  for (const n of notes) say(`NOTE: ${n}`);
  const ctx: CaseContext = { versionOf };
  // The web process may be restarted after a crash: the output is always read from the current one.
  const server = { mark: () => rig.web.mark(), outputSince: (m: number) => rig.web.outputSince(m) };
  const creds = { cookie: rig.author.cookieHeader, token: rig.world.tokens.wide, base: baseUrl, server };
  const outcomes: Outcome[] = [];
  const crashes: string[] = [];
  const started = performance.now();
  for (const [i, c] of cases.entries()) {
    const o = await sendCase(c, ctx, creds);
    outcomes.push(o);
    if (o.status === null) await healthy(rig);
    if (!rig.web.alive) {
      crashes.push(`${line(o)}: web exited (code ${rig.web.exit?.code}, signal ${rig.web.exit?.signal}); restarted`);
      rig.web = await startWeb();
    }
    if ((i + 1) % 250 === 0) say(`${i + 1} sent (${seconds(performance.now() - started)})`);
  }

  const byRoute = new Map<string, Outcome[]>();
  for (const o of outcomes) byRoute.set(o.c.route, [...(byRoute.get(o.c.route) ?? []), o]);
  say(`${outcomes.length} sent in ${seconds(performance.now() - started)}`);
  say(`${"route".padEnd(58)} sent  ok  refused  ≥500/none  slowest`);
  for (const [route, os] of byRoute) {
    const failed = os.filter((o) => o.status === null || o.status >= 500).length;
    const ok = os.filter((o) => !o.refused).length;
    const slowest = Math.max(...os.map((o) => o.ms));
    say(`${route.slice(0, 57).padEnd(58)}${String(os.length).padStart(4)}${String(ok).padStart(4)}${String(os.length - ok - failed).padStart(9)}${String(failed).padStart(11)}  ${seconds(slowest)}`);
  }

  const errors = outcomes.filter((o) => o.status === null || o.status >= 500);
  const partial = outcomes.filter((o) => o.partial.length > 0);
  const slow = outcomes.filter((o) => o.ms > SLOW_MS).sort((a, b) => b.ms - a.ms);
  const slowest = [...outcomes].sort((a, b) => b.ms - a.ms)[0];
  say(`responses ≥ 500 or no answer: ${errors.length}${errors.length ? ", by route and the server's own error:" : ""}`);
  const causes = new Map<string, Outcome[]>();
  for (const o of errors) {
    const key = `${o.c.route} — ${o.status ?? o.error}${o.hint ? `: ${o.hint}` : ""}`;
    causes.set(key, [...(causes.get(key) ?? []), o]);
  }
  for (const [key, os] of causes) say(`  ${key} × ${os.length}: ${os.slice(0, 6).map((o) => o.c.summary).join(" | ")}${os.length > 6 ? " | …" : ""}`);
  say(`partial rows (a refused, failed or read-only request changed a table): ${partial.length}`);
  for (const o of partial.slice(0, 15)) say(`  ${line(o)}: ${o.partial.join(", ")}`);
  say(`over ${SLOW_MS / 1000} s: ${slow.length}; slowest: ${slowest ? line(slowest) : "none"}`);
  for (const o of slow.slice(0, 12)) say(`  ${line(o)}`);
  for (const c of crashes) say(`CRASH: ${c}`);
  const file = join(reliabilitySettings().RELIABILITY_RUN_DIR, "bad-input.jsonl");
  writeFileSync(file, outcomes.map((o) => JSON.stringify({ route: o.c.route, summary: o.c.summary, status: o.status, error: o.error, ms: Math.round(o.ms), refused: o.refused, partial: o.partial, hint: o.hint })).join("\n") + "\n");
  say(`every input's outcome: ${file}`);

  return [
    { figure: "Bad input", goal: `≥ ${MIN_INPUTS.toLocaleString("en")} generated malformed inputs sent`, measured: `${outcomes.length} sent over ${byRoute.size} routes${notes.length ? " (uploads skipped)" : ""}`, pass: outcomes.length >= MIN_INPUTS && notes.length === 0 },
    { figure: "Bad input", goal: "0 responses ≥ 500 (and no crash or unanswered request)", measured: `${errors.length} (${new Set(errors.map((o) => o.c.route)).size} routes)${crashes.length ? `, ${crashes.length} web crashes` : ""}`, pass: errors.length === 0 && crashes.length === 0 },
    { figure: "Bad input", goal: "0 partial rows (refused requests store nothing)", measured: String(partial.length), pass: partial.length === 0 },
    { figure: "Bad input", goal: "no request over 1 s", measured: `${slow.length} over 1 s; slowest ${slowest ? `${seconds(slowest.ms)} (${slowest.c.route}: ${slowest.c.summary})` : "—"}`, pass: slow.length === 0 },
  ];
}
