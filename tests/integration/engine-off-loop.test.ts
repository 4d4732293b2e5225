import { performance } from "node:perf_hooks";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { revisions } from "@/db/schema";
import { basisSize } from "@/lib/tb/basis";
import { setParameters } from "@/lib/tb/parameters";
import { createBoardWorld } from "../support/board-fixtures";
import { gridModel } from "../support/grid-model";
import { watchHealthDuring } from "../support/health-watch";
import { appUrl, HttpSession } from "../support/http-session";

afterAll(closeDb);

/**
 * How long /api/health may take while a request's engine work runs: generous. An idle web process answers in a few
 * milliseconds; one that computes on the request's thread answers only when the computation ends, i.e. after most
 * of the request's own time (this model's first review view: seconds of one core). A machine busy with other work
 * slows both alike, so the ceiling grows with the request's duration: a quarter of it, and never less than 1.5 s.
 */
const healthCeilingMs = (requestMs: number) => Math.max(1500, requestMs / 4);

async function timed<T>(work: () => Promise<T>) {
  const started = performance.now();
  const watched = await watchHealthDuring(appUrl(), work());
  return { ...watched, elapsed: performance.now() - started };
}

describe("engine work off the web process's event loop", () => {
  it("keeps /api/health answering while a large admitted model is saved and its review workspace opened", { timeout: 180_000 }, async () => {
    const base = gridModel([2, 2, 4], { name: "grid supercell" });
    expect(basisSize(base)).toBe(64); // the largest basis the default limit admits
    const world = await createBoardWorld({ base });
    const author = new HttpSession(appUrl());
    expect(await author.signIn(world.author.email, world.author.password)).toBeNull();
    const proposed = setParameters(base, { "shell/A-A/1/pp_pi": -0.8 });

    const save = await timed(() => author.json("/api/proposals", "POST", { familySlug: world.familySlug, baseReleaseId: world.releaseId, title: "Larger pp_pi", document: proposed }));
    expect(save.result.status).toBe(201);
    const { proposalId } = await save.result.json();
    const [revision] = await db.select().from(revisions).where(eq(revisions.proposalId, proposalId));
    expect(revision.maxShift).toBeGreaterThan(0);

    const view = await timed(() => author.fetch(`/proposals/${proposalId}/review`).then(async (res) => ({ status: res.status, html: await res.text() })));
    expect(view.result.status).toBe(200);
    expect(view.result.html).toContain("What it does to the bands");

    const summary = [save, view].map((r, i) => `${["save", "first review view"][i]}: ${r.elapsed.toFixed(0)} ms, ${r.health.latencies.length} health answers, worst ${r.health.worst.toFixed(0)} ms`).join("; ");
    expect(view.health.latencies.length, summary).toBeGreaterThan(2);
    expect(save.health.worst, summary).toBeLessThan(healthCeilingMs(save.elapsed));
    expect(view.health.worst, summary).toBeLessThan(healthCeilingMs(view.elapsed));
  });
});
