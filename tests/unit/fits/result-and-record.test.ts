import { describe, expect, it } from "vitest";
import { appendCost, COST_HISTORY_LIMIT, fitRevisionNote, outcomeOf, statusOfOutcome, type CostPoint } from "@/lib/fits/record";
import { compareReproduction } from "@/lib/fits/reproduce";
import { describeResumes } from "@/lib/fits/view";
import { describeFitWeights, fittedDocument, fittedEnergyRange } from "@/lib/fits/result-document";
import { submissionProblems } from "@/board/submission";
import { fitDocument } from "@/lib/tb/analysis/fit-document";
import { getParameter } from "@/lib/tb/parameters";
import { documentHash } from "@/lib/tb/canonical";
import { spChainDocument } from "../tb/analysis/documents";
import { spec, storedReference } from "./helpers";
import { buildFitProblem } from "@/lib/fits/problem";

const truth = spChainDocument();
const start = spChainDocument({ es: -3.7, sp: 1.3 });
const keys = ["onsite/A/s", "shell/A-A/1/sp_sigma"];
const settings = spec({ parameters: keys.map((key) => ({ key })), window: [-20, 20], bandWeights: [{ band: 1, weight: 2 }] });

async function fitted(seed = 1, restarts = 0) {
  const problem = buildFitProblem(start, storedReference(truth, 0.002, 11), { ...settings, restarts, seed });
  return fitDocument(start, problem.keys, problem.reference, problem.options);
}

describe("the document a fit produces", () => {
  it("carries the fitted values, the reference's provenance, the fit window and weights, and a citation with ±σ per fitted key", async () => {
    const result = await fitted();
    const outcome = outcomeOf(result);
    const reference = storedReference(truth, 0.002, 11);
    const range = fittedEnergyRange(start, reference, settings, outcome.shift);
    expect(range).toEqual([-20, 20]);
    const doc = fittedDocument(start, outcome, settings, { name: "synthetic", provenance: { method: "DFT-test", code: "code 1.0", structureSource: "relaxed" } }, "0123456789abcdef", range);
    keys.forEach((k, i) => {
      expect(getParameter(doc, k)).toBe(outcome.values[i]);
      expect(doc.provenance.citations[k]).toMatch(new RegExp(`^refit to reference bands "synthetic" \\(fit 01234567\\): -?[0-9.]+ ± [0-9.e-]+ eV \\(1σ\\)$`));
    });
    expect(doc.provenance.referenceMethod).toBe("DFT-test");
    expect(doc.provenance.referenceCode).toBe("code 1.0");
    expect(doc.provenance.fitWindow).toEqual([-20, 20]);
    expect(doc.provenance.fitWeights).toBe(describeFitWeights(settings));
    expect(doc.provenance.fitWeights).toBe("alignment none; band offset 0; band weights 1:2");
    // Keys not fitted keep their values and citations.
    expect(getParameter(doc, "onsite/A/pz")).toBe(getParameter(start, "onsite/A/pz"));
  });

  it("recovers the truth behind the synthetic reference (Hellmann–Feynman Jacobian, seeded noise of 2 meV)", async () => {
    const result = await fitted();
    expect(result.status).toBe("converged");
    keys.forEach((k, i) => expect(Math.abs(result.values[i] - getParameter(truth, k))).toBeLessThan(3 * (result.statistics.standardErrors as number[])[i]));
  });

  it("notes what was fitted and how well, for the revision list", async () => {
    const outcome = outcomeOf(await fitted());
    expect(fitRevisionNote(outcome, "PBE bands", "abcdef0123456789")).toMatch(/^Refit of 2 parameters to "PBE bands": RMS [0-9.]+ meV, max [0-9.]+ meV, converged in \d+ iterations \(fit abcdef01\)$/);
    expect(statusOfOutcome({ ...outcome, status: "not converged" })).toBe("not_converged");
    expect(statusOfOutcome({ ...outcome, status: "cancelled" })).toBe("cancelled");
  });
});

describe("the fit window a fit records", () => {
  it("is the span of the aligned reference values that entered the fit when no window was chosen, so the submission gate finds one", async () => {
    const open = spec({ parameters: keys.map((key) => ({ key })) });
    const reference = storedReference(truth, 0.002, 11);
    const problem = buildFitProblem(start, reference, open);
    const result = await fitDocument(start, problem.keys, problem.reference, problem.options);
    const values = reference.energies.flat().filter((e): e is number => e !== null);
    const [lo, hi] = fittedEnergyRange(start, reference, open, result.shift);
    expect(lo).toBeLessThanOrEqual(Math.min(...values));
    expect(lo).toBeGreaterThan(Math.min(...values) - 0.001);
    expect(hi).toBeGreaterThanOrEqual(Math.max(...values));
    expect(hi).toBeLessThan(Math.max(...values) + 0.001);
    const doc = fittedDocument(start, outcomeOf(result), open, { name: "r", provenance: {} }, "abcdefgh", [lo, hi]);
    expect(submissionProblems(null, doc).filter((p) => p.includes("fit window") || p.includes("fit weights"))).toEqual([]);
  });
});

describe("determinism and reproduction", () => {
  it("the same record run twice gives bit-identical values, also with seeded extra starts", async () => {
    const a = await fitted(7, 3);
    const b = await fitted(7, 3);
    expect(b.values).toEqual(a.values);
    expect(documentHash(b.document)).toBe(documentHash(a.document));
    expect(b.starts.map((s) => s.start)).toEqual(a.starts.map((s) => s.start));
    expect(compareReproduction(outcomeOf(a), outcomeOf(b), true)).toEqual({ identical: true, maxDifference: 0, sameEngine: true });
  });

  it("another seed draws other starts, and a changed value is reported with its size", async () => {
    const a = await fitted(7, 2);
    const c = await fitted(8, 2);
    expect(c.starts[1].start).not.toEqual(a.starts[1].start);
    const moved = { ...outcomeOf(a), values: a.values.map((v, i) => (i === 1 ? v + 1e-6 : v)) };
    const r = compareReproduction(outcomeOf(a), moved, false);
    expect(r.identical).toBe(false);
    expect(r.maxDifference).toBeCloseTo(1e-6, 12);
    expect(r.sameEngine).toBe(false);
  });
});

describe("cost history kept in the record", () => {
  it("keeps every point up to the limit, then thins the older half and always keeps the newest", () => {
    let h: CostPoint[] = [];
    for (let i = 1; i <= COST_HISTORY_LIMIT; i++) h = appendCost(h, [i, 1 / i, i]);
    expect(h).toHaveLength(COST_HISTORY_LIMIT);
    h = appendCost(h, [COST_HISTORY_LIMIT + 1, 0, 0]);
    expect(h.length).toBe(COST_HISTORY_LIMIT / 2 + 1);
    expect(h[h.length - 1][0]).toBe(COST_HISTORY_LIMIT + 1);
    expect(h[0][0]).toBe(1);
  });
});

describe("whether a fit may be saved on top of a later revision", () => {
  it("yes when the later revision changed only fitted parameters or nothing physical; no when it moved a fixed one or removed a fitted one", async () => {
    const { fitStillApplies } = await import("@/lib/fits/apply-onto");
    const { setParameters } = await import("@/lib/tb/parameters");
    const outcome = outcomeOf(await fitted());
    expect(fitStillApplies(start, setParameters(start, { "shell/A-A/1/sp_sigma": 0.5 }), outcome)).toBe(true);
    expect(fitStillApplies(start, { ...start, description: "reworded" }, outcome)).toBe(true);
    expect(fitStillApplies(start, setParameters(start, { "shell/A-A/1/pp_sigma": 3 }), outcome)).toBe(false);
    const withoutS = { ...start, onsite: { A: { pz: start.onsite.A.pz } } };
    expect(fitStillApplies(start, withoutS, outcome)).toBe(false);
  });
});

describe("which finished fits are worth an e-mail", () => {
  it("failures always; long runs that converged or stopped; never a cancellation or a short run someone watched", async () => {
    const { shouldMailFit, MAIL_FITS_AFTER_MS } = await import("@/lib/fits/record");
    expect(shouldMailFit("failed", 10)).toBe(true);
    expect(shouldMailFit("converged", MAIL_FITS_AFTER_MS)).toBe(true);
    expect(shouldMailFit("not_converged", MAIL_FITS_AFTER_MS + 1)).toBe(true);
    expect(shouldMailFit("converged", MAIL_FITS_AFTER_MS - 1)).toBe(false);
    expect(shouldMailFit("cancelled", 10 * MAIL_FITS_AFTER_MS)).toBe(false);
  });
});

describe("how the record tells a resumed run", () => {
  it("says nothing for a run in one go, and names each stop or crash and the iteration it resumed from", () => {
    expect(describeResumes([])).toBeNull();
    const at = "2026-01-01T00:00:00Z";
    expect(describeResumes([{ at, by: "crash", iteration: 0, cost: null }])).toBe("Resumed once from its best point so far: after a crash before its first step (from the start).");
    expect(
      describeResumes([
        { at, by: "crash", iteration: 7, cost: 0.5 },
        { at, by: "stop", iteration: 12, cost: 0.2 },
        { at, by: "stop", iteration: 20, cost: 0.1 },
      ]),
    ).toBe("Resumed 3 times from its best point so far: after a crash at iteration 7, after a worker stop at iteration 12, after a worker stop at iteration 20.");
  });
});
