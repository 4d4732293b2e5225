import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import type { MetricsRow } from "@/lib/review/metrics";
import { computeBands } from "@/lib/tb/bands";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { chainDocument } from "../support/board-fixtures";
import { CHAIN_START, createFitWorld, proposalToFit, signedIn, syntheticReference } from "./fit-world";

afterAll(closeDb);

describe("GET /api/proposals/:id/metrics", () => {
  it("recomputes the reference rows for the alignment and window the reviewer picked, and refuses a malformed window", async () => {
    const truth = chainDocument();
    const world = await createFitWorld(truth);
    const { proposalId } = await proposalToFit(world, truth, CHAIN_START, syntheticReference(truth, 0, 1));
    const reviewer = await signedIn(world.reviewer);
    const rows = async (query: string) => {
      const res = await reviewer.fetch(`/api/proposals/${proposalId}/metrics?${query}`);
      expect(res.status).toBe(200);
      return ((await res.json()) as { rows: MetricsRow[] }).rows;
    };
    const points = (r: MetricsRow[]) => r.find((m) => m.key === "points")?.values.proposed;

    // Independent count: reference values (the truth's bands on the default path) inside [-6, 0] eV, no alignment.
    const reference = computeBands(compileModel(truth), samplePath(truth).kFrac).energies.flatMap((row) => Array.from(row));
    expect(points(await rows("alignment=none"))).toBe(reference.length);
    expect(points(await rows("alignment=none&window=-6,0"))).toBe(reference.filter((e) => e >= -6 && e <= 0).length);

    // The RMS of the proposal (start values) against the truth's bands, all values, no alignment.
    const proposed = computeBands(compileModel(setParameters(truth, CHAIN_START)), samplePath(truth).kFrac).energies.flatMap((row) => Array.from(row));
    const rms = Math.sqrt(proposed.reduce((s, e, i) => s + (e - reference[i]) ** 2, 0) / proposed.length);
    expect((await rows("alignment=none")).find((m) => m.key === "rms")?.values.proposed).toBeCloseTo(rms, 9);

    const bad = await reviewer.fetch(`/api/proposals/${proposalId}/metrics?window=3,1`);
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.window).toEqual(["window must be two numbers, lower first, e.g. -8,3"]);
    const stranger = await signedIn(world.stranger);
    expect((await stranger.fetch(`/api/proposals/${proposalId}/metrics`)).status).toBe(403);
  });
});
