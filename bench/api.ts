import { spawn } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { Agent, request } from "node:http";
import { createServer } from "node:net";
import { performance } from "node:perf_hooks";
import { db } from "@/db/client";
import { apiTokens, modelFamilies, releases, users } from "@/db/schema";
import { generateApiToken } from "@/lib/registry/tokens";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { parseModelDocument } from "@/lib/tb/document";

const CONNECTIONS = 16;
const SECONDS = 5;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.listen(0, "127.0.0.1", () => {
      const a = srv.address();
      srv.close(() => (typeof a === "object" && a ? resolve(a.port) : reject(new Error("no port"))));
    });
  });
}

function get(agent: Agent, port: number, path: string, headers: Record<string, string>): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request({ host: "127.0.0.1", port, path, agent, headers }, (res) => {
      res.resume();
      res.on("end", () => resolve(res.statusCode ?? 0));
    });
    req.on("error", reject);
    req.end();
  });
}

/** A closed-loop load generator on loopback: CONNECTIONS keep-alive connections, each sending its next request on the last answer. */
async function load(port: number, path: string, headers: Record<string, string>, expectStatus: number, seconds: number) {
  const agent = new Agent({ keepAlive: true, maxSockets: CONNECTIONS });
  const latencies: number[] = [];
  const end = performance.now() + seconds * 1000;
  let wrong = 0;
  await Promise.all(
    Array.from({ length: CONNECTIONS }, async () => {
      while (performance.now() < end) {
        const t0 = performance.now();
        const status = await get(agent, port, path, headers);
        latencies.push(performance.now() - t0);
        if (status !== expectStatus) wrong++;
      }
    }),
  );
  agent.destroy();
  if (wrong) throw new Error(`${path}: ${wrong} answers were not ${expectStatus}`);
  latencies.sort((a, b) => a - b);
  return { rps: latencies.length / seconds, p99: latencies[Math.floor(latencies.length * 0.99)] };
}

async function seedRelease(): Promise<{ path: string; sha256: string; token: string }> {
  const doc = parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-diamond-sp3s.json", "utf8")));
  const stamp = Date.now();
  const [user] = await db.insert(users).values({ email: `bench-api-${stamp}@bench.invalid`, name: "Bench consumer", roles: ["consumer"] }).returning({ id: users.id });
  const [family] = await db.insert(modelFamilies).values({ slug: `bench-api-${stamp}`, title: "Bench API family", description: "", dimension: 3 }).returning({ id: modelFamilies.id, slug: modelFamilies.slug });
  const sha256 = documentHash(doc);
  await db.insert(releases).values({ familyId: family.id, version: "1.0.0", document: doc, sha256, physicsHash: physicsHash(doc), changelog: "bench" });
  const t = generateApiToken();
  // A limit far above what the bench sends, so every request does the full count-and-check but none is refused.
  await db.insert(apiTokens).values({ userId: user.id, name: "bench", tokenHash: t.hash, prefix: t.prefix, requestsPerMinute: 1_000_000_000 });
  return { path: `/api/v1/families/${family.slug}/releases/1.0.0/document`, sha256, token: t.token };
}

async function waitForReady(port: number): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("next start did not become ready");
}

/** Release-document endpoint with and without a valid ETag, against a prerendered static route, in one run. */
export async function runApiBench(): Promise<void> {
  if (!process.env.DATABASE_URL) return console.log("API benchmark skipped: no DATABASE_URL (run it through `npm run bench`)");
  if (!existsSync(".next/BUILD_ID")) return console.log("API benchmark skipped: no build in .next (run `npm start` or `npm test` once)");
  const { path, sha256, token } = await seedRelease();
  const port = await freePort();
  const server = spawn("node_modules/.bin/next", ["start", "-p", String(port), "-H", "127.0.0.1"], {
    env: { ...process.env, NEXTAUTH_SECRET: "bench-secret-not-for-production-0123456789", BANDGATE_ENV: "test" },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
  try {
    await waitForReady(port);
    const auth = { authorization: `Bearer ${token}` };
    const cases = [
      { label: "static route (prerendered)", path: "/api/v1/openapi.json", headers: {}, status: 200 },
      { label: "document, no ETag", path, headers: auth, status: 200 },
      { label: "document, valid ETag", path, headers: { ...auth, "if-none-match": `"${sha256}"` }, status: 304 },
    ];
    for (const c of cases) await load(port, c.path, c.headers, c.status, 1);
    const results = [];
    for (const c of cases) results.push({ ...c, ...(await load(port, c.path, c.headers, c.status, SECONDS)) });
    const ref = results[0];
    console.log(`API v1 on loopback: ${CONNECTIONS} keep-alive connections, ${SECONDS} s each, one next start (requests/s, p99 ms; ratio against the static route)`);
    for (const r of results) {
      console.log(`  ${r.label.padEnd(28)}${r.rps.toFixed(0).padStart(6)} req/s  ${(r.rps / ref.rps).toFixed(2)}×   p99 ${r.p99.toFixed(1).padStart(6)} ms  ${(r.p99 / ref.p99).toFixed(1)}×`);
    }
  } finally {
    if (server.pid) process.kill(-server.pid, "SIGTERM");
  }
}
