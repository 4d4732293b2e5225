import { describe, expect, it } from "vitest";
import { initialFitForm, toFitSpec } from "@/lib/fits/form";
import { fitSpecSchema } from "@/lib/fits/spec";
import { REFERENCE_ID } from "./helpers";

const params = [
  { key: "onsite/A/s", label: "ε(A, s)", value: -5 },
  { key: "shell/A-A/1/ss_sigma", label: "ss_sigma", value: -1.4 },
];

function messages(input: unknown): string[] {
  const r = fitSpecSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
}

describe("fit settings (zod)", () => {
  const ok = { referenceSetId: REFERENCE_ID, parameters: [{ key: "onsite/A/s" }] };

  it("fills defaults: no window, alignment none, offset 0, 200 iterations, no extra starts, seed 1, open bounds", () => {
    const s = fitSpecSchema.parse(ok);
    expect(s).toMatchObject({ window: null, alignment: "none", bandOffset: 0, maxIterations: 200, restarts: 0, seed: 1, bandWeights: [], regionWeights: [] });
    expect(s.parameters[0]).toEqual({ key: "onsite/A/s", lower: null, upper: null });
  });

  it("refuses what cannot be a fit, saying which field", () => {
    expect(messages({ ...ok, parameters: [] })).toEqual(["parameters: Choose at least one parameter to fit."]);
    expect(messages({ ...ok, parameters: [{ key: "a" }, { key: "a" }] })).toEqual(["parameters: A parameter is listed twice."]);
    expect(messages({ ...ok, parameters: [{ key: "a", lower: 2, upper: 1 }] })).toEqual(["parameters.0.upper: lower bound is above the upper bound"]);
    expect(messages({ ...ok, window: [1, -1] })).toEqual(["window: The window's lower edge must be below its upper edge."]);
    expect(messages({ ...ok, bandWeights: [{ band: 0, weight: -1 }] })).toEqual(["bandWeights.0.weight: weights must be ≥ 0"]);
    expect(messages({ ...ok, regionWeights: [{ from: 2, to: 1, weight: 1 }] })).toEqual(["regionWeights.0.to: a region must start before it ends"]);
    expect(messages({ ...ok, referenceSetId: "nope" })).toEqual(["referenceSetId: Choose a reference band set."]);
    expect(messages({ ...ok, maxIterations: 0 })).toHaveLength(1);
    expect(messages({ ...ok, alignment: "fermi" })).toHaveLength(1);
  });
});

describe("the refit form", () => {
  it("starts with every parameter fixed, so nothing is fitted by accident", () => {
    const form = initialFitForm(params, REFERENCE_ID);
    expect(form.rows.every((r) => !r.free)).toBe(true);
    expect(toFitSpec(form).errors).toContain("choose at least one parameter to fit (tick “free”)");
  });

  it("reads bounds, a window, weights and a Unicode minus or decimal comma into settings the schema accepts", () => {
    const form = initialFitForm(params, REFERENCE_ID);
    form.rows[1] = { ...form.rows[1], free: true, lower: "−2,5", upper: "" };
    form.windowLower = "-8";
    form.windowUpper = "3.5";
    form.bandWeights = [{ band: "1", weight: "4" }];
    form.regionWeights = [{ from: "0", to: "0.3", weight: "2" }];
    const { spec, errors } = toFitSpec(form);
    expect(errors).toEqual([]);
    const parsed = fitSpecSchema.parse(spec);
    expect(parsed.parameters).toEqual([{ key: "shell/A-A/1/ss_sigma", lower: -2.5, upper: null }]);
    expect(parsed.window).toEqual([-8, 3.5]);
    expect(parsed.bandWeights).toEqual([{ band: 1, weight: 4 }]);
    expect(parsed.regionWeights).toEqual([{ from: 0, to: 0.3, weight: 2 }]);
  });

  it("names each unreadable field and a half-given window", () => {
    const form = initialFitForm(params, REFERENCE_ID);
    form.rows[0] = { ...form.rows[0], free: true, upper: "abc" };
    form.windowLower = "1";
    form.maxIterations = "";
    const { errors } = toFitSpec(form);
    expect(errors).toEqual([
      'upper bound of ε(A, s): "abc" is not a number',
      "give both window edges, or neither for every energy",
      "maximum iterations is required",
    ]);
  });
});

describe("messages in the form's words", () => {
  it("names the field behind each server error and refuses hexadecimal and band weights beyond the reference", async () => {
    const { describeFieldErrors, checkAgainstReference } = await import("@/lib/fits/form");
    const spec = { referenceSetId: REFERENCE_ID, parameters: [{ key: "onsite/A/s" }, { key: "shell/A-A/1/ss_sigma" }], bandWeights: [{ band: 0, weight: 1 }, { band: 7, weight: 2 }] };
    expect(describeFieldErrors({ "parameters.1.upper": ["lower bound is above the upper bound"], window: ["bad"], "bandWeights.0.weight": ["weights must be ≥ 0"] }, spec, { "shell/A-A/1/ss_sigma": "ss_sigma" })).toEqual([
      "upper bound of ss_sigma: lower bound is above the upper bound",
      "window: bad",
      "band weight row 1: weights must be ≥ 0",
    ]);
    expect(checkAgainstReference(spec, 2)).toEqual(["band weight row 2: the reference has bands 0–1 only"]);
    const form = initialFitForm(params, REFERENCE_ID);
    form.rows[0] = { ...form.rows[0], free: true, lower: "0x10" };
    expect(toFitSpec(form).errors).toEqual(['lower bound of ε(A, s): "0x10" is not a number']);
  });
});
