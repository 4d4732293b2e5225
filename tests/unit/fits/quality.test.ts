import { describe, expect, it } from "vitest";
import { buildFitProblem } from "@/lib/fits/problem";
import { buildFitQuality } from "@/lib/fits/quality";
import { outcomeOf } from "@/lib/fits/record";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { spChainDocument } from "../tb/analysis/documents";
import { spec, storedReference } from "./helpers";

describe("fit-quality data", () => {
  it("its residuals are the fit's own: same count, same RMS and max as the stored outcome (least-squares shift, offset band)", async () => {
    const truth = spChainDocument();
    const start = spChainDocument({ ep: 2.4, pp: 1.5 });
    const reference = storedReference(truth, 0.003, 5, -30);
    const settings = spec({ parameters: [{ key: "onsite/A/pz" }, { key: "shell/A-A/1/pp_sigma" }], bandOffset: 1, alignment: "least-squares" });
    const problem = buildFitProblem(start, reference, settings);
    const result = await fitDocument(start, problem.keys, problem.reference, problem.options);
    const q = buildFitQuality(start, result.document, reference, settings, outcomeOf(result));
    expect(q.residuals).toHaveLength(result.points);
    const rms = Math.sqrt(q.residuals.reduce((s, r) => s + r[1] ** 2, 0) / q.residuals.length);
    expect(rms).toBeCloseTo(result.rms, 12);
    expect(Math.max(...q.residuals.map((r) => Math.abs(r[1])))).toBeCloseTo(result.maxAbs, 12);
    // The drawn reference drops the deep band (offset 1) and sits on the model's energy zero.
    expect(q.reference.energies[0]).toHaveLength(2);
    expect(q.reference.energies[0][0]).toBeCloseTo((reference.energies[0][1] as number) + result.shift, 12);
    expect(q.fitted).toHaveLength(q.distance.length);
  });
});
