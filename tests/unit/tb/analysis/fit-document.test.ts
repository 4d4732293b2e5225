import { describe, expect, it } from "vitest";
import type { ModelDocument } from "@/lib/tb/document";
import { computeBands } from "@/lib/tb/bands";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { getParameter, setParameters } from "@/lib/tb/parameters";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { spChainDocument, zincBlendeDocument } from "./documents";
import { seededNormal } from "./seeded-noise";

const keys = ["shell/A-B/1/sp_sigma", "shell/A-B/1/pp_sigma", "shell/A-B/1/pp_pi", "onsite/A/s"];

describe("fit of document parameters to reference bands", () => {
  it("recovers the parameters behind a synthetic reference (seeded noise, extra deep band, shifted zero)", async () => {
    const truth = zincBlendeDocument();
    const path = samplePath(truth);
    const exact = computeBands(compileModel(truth), path.kFrac).energies;
    const noise = seededNormal(2024);
    const sigma = 0.005;
    // Reference: one deep band below the model's (band offset 1) and an energy zero 1 eV lower (least-squares shift).
    const reference = { kFrac: path.kFrac, energies: exact.map((row) => [-40, ...Array.from(row, (e) => e - 1 + sigma * noise())]) };
    const start = setParameters(truth, { [keys[0]]: 1.6, [keys[1]]: 3.5, [keys[2]]: -0.5, [keys[3]]: -7.5 });
    const res = await fitDocument(start, keys, reference, { alignment: "least-squares", bandOffset: 1, window: [-20, 10] });
    expect(res.status).toBe("converged");
    const se = res.statistics.standardErrors as number[];
    keys.forEach((k, i) => {
      expect(Math.abs(res.values[i] - getParameter(truth, k))).toBeLessThan(4 * se[i]);
      expect(getParameter(res.document, k)).toBe(res.values[i]);
    });
    expect(res.shift).toBeCloseTo(1, 2);
    expect(res.rms).toBeLessThan(2 * sigma);
    expect(res.perBand).toHaveLength(8);
  });

  it("refuses unknown keys, mismatched k dimensions and a lone mirror key of a one-species shell", async () => {
    const doc = zincBlendeDocument();
    const ref = { kFrac: [[0, 0, 0], [0.1, 0, 0]], energies: [[0, 1], [0, 1]] };
    await expect(fitDocument(doc, ["shell/A-B/1/dd_sigma"], ref)).rejects.toThrow(/unknown parameter key/);
    await expect(fitDocument(doc, keys, { kFrac: [[0, 0]], energies: [[0]] })).rejects.toThrow(/2 components, the lattice has dimension 3/);
    const chain: ModelDocument = structuredClone(spChainDocument());
    chain.shells[0].params.ps_sigma = chain.shells[0].params.sp_sigma;
    await expect(fitDocument(chain, ["shell/A-A/1/sp_sigma"], { kFrac: [[0]], energies: [[0]] })).rejects.toThrow(/one integral in a one-species shell/);
  });
});
