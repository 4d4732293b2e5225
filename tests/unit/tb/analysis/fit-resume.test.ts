import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { fitDocument, type DocumentFitOptions, type FitCheckpoint } from "@/lib/tb/analysis/fit-document";
import { zincBlendeDocument } from "./documents";
import { seededNormal } from "./seeded-noise";

/*
 * A fit stopped at any accepted step and resumed from its checkpoint must end exactly where the uninterrupted fit
 * ends: same values to the bit, same cost per iteration after the resume point. The checkpoint goes through JSON
 * first, as it does on its way through the database.
 */
const keys = ["shell/A-B/1/sp_sigma", "shell/A-B/1/pp_sigma", "shell/A-B/1/pp_pi", "onsite/A/s"];
const truth = zincBlendeDocument();
const path = samplePath(truth);
const noise = seededNormal(7);
const reference = { kFrac: path.kFrac, energies: computeBands(compileModel(truth), path.kFrac).energies.map((row) => Array.from(row, (e) => e - 0.5 + 0.004 * noise())) };
const start = setParameters(truth, { [keys[0]]: 1.6, [keys[1]]: 3.5, [keys[2]]: -0.5, [keys[3]]: -7.5 });
const options: DocumentFitOptions = { alignment: "least-squares", window: [-20, 10], restarts: 2, seed: 11 };

interface Trace {
  history: [number, number][];
  checkpoints: FitCheckpoint[];
}

async function traced(extra: DocumentFitOptions = {}, abortAt?: number) {
  const trace: Trace = { history: [], checkpoints: [] };
  const controller = new AbortController();
  const result = await fitDocument(start, keys, reference, {
    ...options,
    ...extra,
    signal: controller.signal,
    onProgress: (p) => {
      trace.history.push([p.iteration, p.cost]);
      trace.checkpoints.push(JSON.parse(JSON.stringify(p.checkpoint)) as FitCheckpoint);
      if (p.iteration === abortAt) controller.abort();
    },
  });
  return { result, trace };
}

describe("a refit resumed from a checkpoint", () => {
  it("ends, to the bit, where the uninterrupted fit ends, from any accepted step of any start", async () => {
    const whole = await traced();
    expect(whole.result.status).toBe("converged");
    expect(whole.result.starts).toHaveLength(3);
    const runs = whole.trace.checkpoints.map((c) => c.run);
    // The first step, the last step of the first start, the first step of the second start, the last step but one.
    const picks = [0, runs.lastIndexOf(0), runs.indexOf(1), runs.length - 2];
    expect(new Set(runs.filter((_, i) => picks.includes(i)))).toEqual(new Set([0, 1, runs.at(-2)]));
    for (const at of picks) {
      const checkpoint = whole.trace.checkpoints[at];
      expect(checkpoint.iteration).toBe(whole.trace.history[at][0]);
      const resumed = await traced({ resume: checkpoint });
      expect(resumed.result.values, `resumed after step ${at}`).toEqual(whole.result.values);
      whole.result.values.forEach((v, i) => expect(Object.is(v, resumed.result.values[i])).toBe(true));
      expect(resumed.result.cost).toBe(whole.result.cost);
      expect(resumed.result.iterations).toBe(whole.result.iterations);
      expect(resumed.result.starts).toEqual(whole.result.starts);
      expect(resumed.result.startRms).toBe(whole.result.startRms);
      expect(resumed.result.statistics).toEqual(whole.result.statistics);
      expect(resumed.trace.history).toEqual(whole.trace.history.slice(at + 1));
    }
  });

  it("keeps the lowest cost reached in its checkpoint, which never rises", async () => {
    const whole = await traced();
    const best = whole.trace.checkpoints.map((c) => c.cost);
    best.slice(1).forEach((c, i) => expect(c).toBeLessThanOrEqual(best[i]));
    whole.trace.checkpoints.forEach((c, i) => expect(c.cost).toBe(Math.min(...whole.trace.history.slice(0, i + 1).map(([, cost]) => cost))));
  });

  it("continues a stopped fit from its last checkpoint, as a worker does after a graceful stop", async () => {
    const whole = await traced();
    const stoppedAt = whole.trace.history[whole.trace.checkpoints.findIndex((c) => c.run === 1) + 1][0];
    const stopped = await traced({}, stoppedAt);
    expect(stopped.result.status).toBe("cancelled");
    const last = stopped.trace.checkpoints.at(-1) as FitCheckpoint;
    expect(last.iteration).toBe(stoppedAt);
    const resumed = await traced({ resume: last });
    expect(resumed.result.values).toEqual(whole.result.values);
    expect([...stopped.trace.history, ...resumed.trace.history]).toEqual(whole.trace.history);
    expect(resumed.result.elapsedMs).toBeGreaterThanOrEqual(last.elapsedMs);
  });

  it("refuses a checkpoint that cannot belong to the fit", async () => {
    const whole = await traced();
    const checkpoint = whole.trace.checkpoints[0];
    await expect(fitDocument(start, keys, reference, { ...options, resume: { ...checkpoint, run: 5 } })).rejects.toThrow(/checkpoint does not belong/);
    await expect(fitDocument(start, keys, reference, { ...options, resume: { ...checkpoint, finished: [] , run: 1 } })).rejects.toThrow(/checkpoint does not belong/);
  });
});
