import { describe, expect, it } from "vitest";
import type { ReferenceBands } from "@/lib/tb/analysis/compare-reference";
import { fitBandModel, type FitModel } from "@/lib/tb/analysis/fit";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import { lineSamples } from "./band-models";
import { seededNormal } from "./seeded-noise";

// Dimerised chain, bands ±√(v² + w² + 2vw·cos 2πk) (Su, Schrieffer & Heeger, PRL 42, 1698 (1979)), with the
// analytic derivatives ∂E/∂v = ±(v + w·cos)/|E|, ∂E/∂w = ±(w + v·cos)/|E|: a non-linear two-parameter model.
const path = lineSamples(60, true);
const dimer: FitModel = {
  evaluate(p) {
    const [v, w] = p;
    const energies: Float64Array[] = [];
    const derivatives: Float64Array[] = [];
    for (const [k] of path) {
      const c = Math.cos(2 * Math.PI * k);
      const e = Math.sqrt(v * v + w * w + 2 * v * w * c);
      energies.push(Float64Array.of(-e, e));
      const dv = (v + w * c) / e;
      const dw = (w + v * c) / e;
      derivatives.push(Float64Array.of(-dv, -dw, dv, dw));
    }
    return { energies, derivatives };
  },
};
const truth = [1.3, 0.6];
const noiseSigma = 0.01;

function syntheticReference(seed: number, offset = 0): ReferenceBands {
  const noise = seededNormal(seed);
  const exact = dimer.evaluate(Float64Array.from(truth)).energies;
  return { kFrac: path, energies: exact.map((row) => Array.from(row, (e) => e + offset + noiseSigma * noise())) };
}

describe("Levenberg–Marquardt band fit", () => {
  it("recovers known parameters from a noisy synthetic reference within the stated uncertainties", async () => {
    const progress: number[] = [];
    const res = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(7), { onProgress: (p) => progress.push(p.cost) });
    expect(res.status).toBe("converged");
    const se = res.statistics.standardErrors as number[];
    res.values.forEach((x, i) => expect(Math.abs(x - truth[i])).toBeLessThan(4 * se[i]));
    expect(se[0]).toBeLessThan(0.01);
    // With the right model the residual RMS estimates the injected noise.
    expect(res.rms).toBeGreaterThan(0.7 * noiseSigma);
    expect(res.rms).toBeLessThan(1.3 * noiseSigma);
    expect(Math.sqrt(res.statistics.residualVariance)).toBeCloseTo(noiseSigma, 2);
    expect(progress.length).toBeGreaterThan(0);
    progress.slice(1).forEach((c, i) => expect(c).toBeLessThanOrEqual(progress[i]));
    expect(res.perBand.map((b) => b.modelBand)).toEqual([0, 1]);
    expect(Math.abs(res.statistics.correlations?.[0][1] ?? 2)).toBeLessThanOrEqual(1);
  });

  it("is deterministic", async () => {
    const a = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(3));
    const b = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(3));
    expect(a.values).toEqual(b.values);
  });

  it("fits the energy zero too with the least-squares alignment", async () => {
    const res = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(11, -2.5), { alignment: "least-squares" });
    expect(res.shift).toBeCloseTo(2.5, 2);
    res.values.forEach((x, i) => expect(x).toBeCloseTo(truth[i], 1));
  });

  it("aligns valence-band maxima during the fit ('vbm' alignment)", async () => {
    const res = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(13, 0.8), { alignment: "vbm", occupiedBands: 1 });
    expect(res.status).toBe("converged");
    expect(res.shift).toBeCloseTo(-0.8, 1);
    res.values.forEach((x, i) => expect(x).toBeCloseTo(truth[i], 1));
  });

  it("keeps parameters inside their bounds (projection)", async () => {
    const res = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(5), { upper: [1.2, 2] });
    expect(res.values[0]).toBeLessThanOrEqual(1.2);
    expect(res.values[0]).toBeCloseTo(1.2, 8);
  });

  it("stops with status 'cancelled' and the best point when aborted", async () => {
    const controller = new AbortController();
    const res = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], syntheticReference(5), {
      signal: controller.signal,
      onProgress: () => controller.abort(),
    });
    expect(res.status).toBe("cancelled");
    expect(res.iterations).toBe(1);
    expect(res.cost).toBeGreaterThan(0);
  });

  it("refuses bad input before starting, saying which", async () => {
    const ref = syntheticReference(1);
    const withNaN: ReferenceBands = { kFrac: path, energies: ref.energies.map((row, k) => (k === 4 ? [NaN, row[1]] : row)) };
    const cases: [Promise<unknown>, RegExp][] = [
      [fitBandModel(dimer, ["v", "w"], [1, 0.3], withNaN), /k-point 4, band 0 is NaN/],
      [fitBandModel(dimer, ["v", "w"], [1, 0.3], ref, { lower: [1.1, 0] }), /start value 1 of v lies outside/],
      [fitBandModel(dimer, ["v", "w"], [1, 0.3], ref, { window: [10, 20] }), /window \[10, 20\] eV holds no reference/],
      [fitBandModel(dimer, ["v", "w"], [1, 0.3], { kFrac: [[0]], energies: [[-1]] }), /model must be evaluated|need more points/],
      [fitBandModel(dimer, ["v", "w"], [1, 0.3], ref, { alignment: "fermi" }), /'fermi' is not available/],
    ];
    for (const [run, message] of cases) await expect(run).rejects.toThrow(message);
    const onePoint: ReferenceBands = { kFrac: path, energies: path.map((_, k) => (k === 0 ? [-1.9, null] : [null, null])) };
    await expect(fitBandModel(dimer, ["v", "w"], [1, 0.3], onePoint)).rejects.toBeInstanceOf(FitInputError);
    await expect(fitBandModel(dimer, ["v", "w"], [1, 0.3], onePoint)).rejects.toThrow(/1 reference points for 2 free parameters/);
  });

  it("honours per-band weights (weight 0 drops a band) and reports 'not converged' with the best point so far", async () => {
    const ref = syntheticReference(9);
    const weighted = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], ref, { bandWeights: { 1: 0 } });
    expect(weighted.perBand.map((b) => b.modelBand)).toEqual([0]);
    const startCost = (await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], ref, { maxIterations: 0 })).cost;
    const short = await fitBandModel(dimer, ["v", "w"], [1.0, 0.3], ref, { maxIterations: 1 });
    expect(short.status).toBe("not converged");
    expect(short.cost).toBeLessThan(startCost);
  });
});
