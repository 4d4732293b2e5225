import { spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import { performance } from "node:perf_hooks";
import { db } from "@/db/client";
import { modelFamilies, releases, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/secrets";
import { basisSize } from "@/lib/tb/basis";
import { documentHash, physicsHash } from "@/lib/tb/canonical";
import { setParameters } from "@/lib/tb/parameters";
import { gridModel } from "../tests/support/grid-model";
import { watchHealthDuring } from "../tests/support/health-watch";
import { HttpSession } from "../tests/support/http-session";

const PASSWORD = "bench-password-not-secret";

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.listen(0, "127.0.0.1", () => {
      const a = srv.address();
      srv.close(() => (typeof a === "object" && a ? resolve(a.port) : reject(new Error("no port"))));
    });
  });
}

async function waitForReady(base: string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("next start did not become ready");
}

async function seed(grid: [number, number, number]) {
  const base = gridModel(grid, { name: "bench supercell" });
  const stamp = Date.now();
  const [author] = await db
    .insert(users)
    .values({ email: `bench-engine-${stamp}@bench.invalid`, name: "Bench author", roles: ["author"], passwordHash: await hashPassword(PASSWORD) })
    .returning({ id: users.id, email: users.email });
  const [family] = await db.insert(modelFamilies).values({ slug: `bench-engine-${stamp}`, title: "Bench engine family", description: "", dimension: 3 }).returning({ id: modelFamilies.id, slug: modelFamilies.slug });
  const [release] = await db.insert(releases).values({ familyId: family.id, version: "1.0.0", document: base, sha256: documentHash(base), physicsHash: physicsHash(base), changelog: "bench" }).returning({ id: releases.id });
  return { base, author, family, release };
}

const ms = (x: number) => `${x.toFixed(0).padStart(6)} ms`;

/**
 * The web process while the engine works: a large model is saved through the API and its review workspace opened
 * for the first time and again, while /api/health is asked again as soon as it answers. The worst health answer is
 * how long the process could not answer anyone. BENCH_ENGINE_GRID="nx,ny,nz" picks the model (4 orbitals per site;
 * default 2,2,4 = 64 states, the default basis limit); BENCH_APP_URL measures an app already running there instead.
 */
export async function runEngineLoadBench(): Promise<void> {
  if (!process.env.DATABASE_URL) return console.log("engine load benchmark skipped: no DATABASE_URL (run it through `npm run bench`)");
  const grid = (process.env.BENCH_ENGINE_GRID ?? "2,2,4").split(",").map(Number) as [number, number, number];
  const external = process.env.BENCH_APP_URL;
  if (!external && !existsSync(".next/BUILD_ID")) return console.log("engine load benchmark skipped: no build in .next");
  const { base, author, family, release } = await seed(grid);
  const port = await freePort();
  const url = external ?? `http://127.0.0.1:${port}`;
  const server = external
    ? null
    : spawn("node_modules/.bin/next", ["start", "-p", String(port), "-H", "127.0.0.1"], {
        env: { ...process.env, NEXTAUTH_SECRET: "bench-secret-not-for-production-0123456789", NEXTAUTH_URL: url, APP_URL: url, BANDGATE_ENV: "test", MODEL_BASIS_LIMIT: String(Math.max(64, basisSize(base))) },
        stdio: ["ignore", "ignore", "inherit"],
        detached: true,
      });
  try {
    await waitForReady(url);
    const session = new HttpSession(url);
    const failed = await session.signIn(author.email, PASSWORD);
    if (failed) throw new Error(`bench sign-in failed: ${failed}`);
    const proposed = setParameters(base, { "shell/A-A/1/pp_pi": -0.8 });
    const timed = async <T>(work: () => Promise<T>) => {
      const t0 = performance.now();
      const { result, health } = await watchHealthDuring(url, work());
      return { result, elapsed: performance.now() - t0, health };
    };
    const save = await timed(() => session.json("/api/proposals", "POST", { familySlug: family.slug, baseReleaseId: release.id, title: "bench", document: proposed }));
    if (save.result.status !== 201) throw new Error(`saving the bench model answered ${save.result.status}: ${await save.result.text()}`);
    const { proposalId } = (await save.result.json()) as { proposalId: string };
    const view = () => session.fetch(`/proposals/${proposalId}/review`).then(async (r) => ({ status: r.status, length: (await r.text()).length }));
    const first = await timed(view);
    const repeat = await timed(view);
    console.log(`Engine off the event loop: ${grid.join("×")} sites × 4 orbitals = ${basisSize(base)} states, 3D (${external ? url : "next start"}); /api/health asked again as soon as it answers`);
    for (const [label, r] of [["save (POST /api/proposals)", save], ["first review workspace view", first], ["repeat review workspace view", repeat]] as const) {
      const sorted = [...r.health.latencies].sort((a, b) => a - b);
      const median = sorted[Math.floor(sorted.length / 2)] ?? 0;
      console.log(`  ${label.padEnd(30)} request ${ms(r.elapsed)}   health: ${String(sorted.length).padStart(4)} answers, median ${ms(median)}, worst ${ms(r.health.worst)}`);
    }
  } finally {
    if (server?.pid) process.kill(-server.pid, "SIGTERM");
  }
}
