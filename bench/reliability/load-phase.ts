import { countBy, latencySummary, percentile, runLoad, statusLabel } from "./http-load";
import { heading, say, type GoalRow } from "./report";
import { reliabilitySettings } from "./settings";

export const LOAD_CLIENTS = 16;
const LOAD_SECONDS = 10;
const TOKEN_LIMIT = 600;

/** Room the run wants in one fixed rate window: the 10 s figure, and time to go on to the limit on a slow machine. */
const WINDOW_ROOM_MS = 50_000;

/** Waits, if needed, for the next one-minute rate window, so the count starts from zero and the run fits in it. Returns its end. */
async function alignToRateWindow(): Promise<number> {
  const left = 60_000 - (Date.now() % 60_000);
  if (left < WINDOW_ROOM_MS) await new Promise((r) => setTimeout(r, left + 250));
  return performance.now() + (60_000 - (Date.now() % 60_000));
}

/**
 * Figure 1: 16 keep-alive clients for 10 s on one registry endpoint with one API token (limit 600 a minute). When
 * the machine is too slow to send 600 requests in 10 s, the same clients go on (within the same rate window) until
 * the limit is passed, so that the 429 half of the goal is still measured.
 */
export async function runLoadFigure(path: string, token: string): Promise<GoalRow[]> {
  heading(`Load: ${LOAD_CLIENTS} keep-alive clients, ${LOAD_SECONDS} s, one token, GET ${path}`);
  const windowEnd = await alignToRateWindow();
  const started = performance.now();
  let sent = 0;
  const samples = await runLoad({
    port: reliabilitySettings().RELIABILITY_WEB_PORT,
    path,
    headers: { authorization: `Bearer ${token}` },
    clients: LOAD_CLIENTS,
    stop: () => {
      const now = performance.now();
      const more = now - started < LOAD_SECONDS * 1000 || (sent < TOKEN_LIMIT + 40 && now < windowEnd - 1500);
      if (more) sent++;
      return !more;
    },
    abandonMs: 30_000,
  });
  const figure = samples.filter((s) => s.sent - started < LOAD_SECONDS * 1000);
  const extended = samples.length > figure.length;
  const byStatus = countBy(samples, statusLabel);
  const ok = samples.filter((s) => s.status === 200);
  const limited = samples.filter((s) => s.status === 429);
  const errors = samples.filter((s) => s.status === null);
  const other = samples.length - ok.length - limited.length - errors.length;
  // Each 200 carries RateLimit-Remaining = 600 − its place in the count: 599 … 0 exactly once means these were the first 600.
  const remaining = new Set(ok.map((s) => Number(s.remaining)));
  const firstSix = ok.length === TOKEN_LIMIT && remaining.size === TOKEN_LIMIT && [...remaining].every((r) => r >= 0 && r < TOKEN_LIMIT);
  const withRetryAfter = limited.filter((s) => s.retryAfter !== null && /^\d+$/.test(s.retryAfter) && Number(s.retryAfter) >= 1 && Number(s.retryAfter) <= 60);
  const wall = (performance.now() - started) / 1000;

  say(`first ${LOAD_SECONDS} s: ${figure.length} requests (${(figure.length / LOAD_SECONDS).toFixed(0)}/s): ${[...countBy(figure, statusLabel)].map(([k, v]) => `${v} × ${k}`).join(", ")}`);
  say(`latency, first ${LOAD_SECONDS} s: ${latencySummary(figure)}`);
  if (extended) say(`fewer than ${TOKEN_LIMIT} requests in ${LOAD_SECONDS} s on this machine: went on to ${wall.toFixed(1)} s in the same rate window to pass the limit`);
  say(`whole run: ${samples.length} requests in ${wall.toFixed(1)} s: ${[...byStatus].map(([k, v]) => `${v} × ${k}`).join(", ")}`);
  if (ok.length) say(`latency, 200: ${latencySummary(ok)}`);
  if (limited.length) say(`latency, 429: ${latencySummary(limited)}`);
  say(`200s are the first ${TOKEN_LIMIT} counted (RateLimit-Remaining 599…0, each once): ${firstSix ? "yes" : "no"}`);
  say(`429s with a valid Retry-After (1–60 s): ${withRetryAfter.length} of ${limited.length}`);
  return [
    { figure: "Load", goal: "0 errors (no failed or abandoned request)", measured: `${errors.length} errors, ${other} other statuses; p99 ${percentile(figure.map((x) => x.done - x.sent).sort((a, b) => a - b), 99).toFixed(0)} ms`, pass: errors.length === 0 && other === 0 },
    {
      figure: "Load",
      goal: "600 × 200, then 429 with Retry-After",
      measured: `${ok.length} × 200${firstSix ? "" : " (not the first 600 counted)"}, ${limited.length} × 429 (${withRetryAfter.length} with Retry-After)${extended ? `, in ${wall.toFixed(0)} s (slow machine)` : ""}`,
      pass: firstSix && limited.length > 0 && withRetryAfter.length === limited.length,
    },
  ];
}
