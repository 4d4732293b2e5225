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
 * Generous: an idle web process answers /api/health in a few milliseconds, and one whose engine work runs on its own
 * threads stays far below this even with both cores busy. Computing this model's review workspace on the request's
 * thread takes several seconds of one core, during which nothing else is answered.
 */
const HEALTH_CEILING_MS = 1500;

describe("engine work off the web process's event loop", () => {
  it("keeps /api/health answering while a large admitted model is saved and its review workspace opened", { timeout: 180_000 }, async () => {
    const base = gridModel([2, 2, 4], { name: "grid supercell" });
    expect(basisSize(base)).toBe(64); // the largest basis the default limit admits
    const world = await createBoardWorld({ base });
    const author = new HttpSession(appUrl());
    expect(await author.signIn(world.author.email, world.author.password)).toBeNull();
    const proposed = setParameters(base, { "shell/A-A/1/pp_pi": -0.8 });

    const save = await watchHealthDuring(
      appUrl(),
      author.json("/api/proposals", "POST", { familySlug: world.familySlug, baseReleaseId: world.releaseId, title: "Larger pp_pi", document: proposed }),
    );
    expect(save.result.status).toBe(201);
    const { proposalId } = await save.result.json();
    const [revision] = await db.select().from(revisions).where(eq(revisions.proposalId, proposalId));
    expect(revision.maxShift).toBeGreaterThan(0);

    const view = await watchHealthDuring(
      appUrl(),
      author.fetch(`/proposals/${proposalId}/review`).then(async (res) => ({ status: res.status, html: await res.text() })),
    );
    expect(view.result.status).toBe(200);
    expect(view.result.html).toContain("What it does to the bands");

    const summary = `save: ${save.health.latencies.length} answers, worst ${save.health.worst.toFixed(0)} ms; review: ${view.health.latencies.length} answers, worst ${view.health.worst.toFixed(0)} ms`;
    expect(view.health.latencies.length, summary).toBeGreaterThan(2);
    expect(Math.max(save.health.worst, view.health.worst), summary).toBeLessThan(HEALTH_CEILING_MS);
  });
});
