import { describe, expect, it } from "vitest";
import { buildFitPreview } from "@/lib/fits/preview";
import { buildFitProblem } from "@/lib/fits/problem";
import { FitInputError } from "@/lib/tb/analysis/fit-input";
import { sChainDocument, spChainDocument } from "../tb/analysis/documents";
import { spec, storedReference } from "./helpers";

const doc = spChainDocument();
const free = [{ key: "onsite/A/s" }, { key: "shell/A-A/1/sp_sigma" }];

describe("fit settings → the engine's problem", () => {
  it("puts the reference on the document's path points and turns null bounds into open ones", () => {
    const ref = storedReference(doc);
    const p = buildFitProblem(doc, ref, spec({ parameters: [{ key: "onsite/A/s", lower: -6, upper: null }] }));
    expect(p.reference.kFrac).toHaveLength(ref.pointCount);
    expect(p.options.lower).toEqual([-6]);
    expect(p.options.upper).toEqual([Infinity]);
    expect(p.distance).toHaveLength(ref.pointCount);
  });

  it("multiplies the weights of overlapping regions at each point, by its position along the path", () => {
    const ref = storedReference(doc);
    const p = buildFitProblem(doc, ref, spec({ parameters: free, regionWeights: [{ from: 0, to: 0.5, weight: 2 }, { from: 0.25, to: 10, weight: 3 }] }));
    p.distance.forEach((d, k) => {
      const expected = (d <= 0.5 ? 2 : 1) * (d >= 0.25 ? 3 : 1);
      expect(p.options.pointWeights?.[k]).toEqual([expected, expected]);
    });
  });
});

describe("preview of a fit", () => {
  const ref = storedReference(doc);
  const all = ref.energies.flat().length;

  it("counts every reference value when nothing restricts the fit", () => {
    const v = buildFitPreview(doc, ref, spec({ parameters: free }));
    expect(v.points).toBe(all);
    expect(v.excluded).toBe(0);
    expect(v.kPoints).toBe(ref.pointCount);
    expect(v.perBand.map((b) => b.points)).toEqual([ref.pointCount, ref.pointCount]);
  });

  it("leaves out values outside the window and of zero-weight bands, and says how many", () => {
    const window: [number, number] = [-10, 0];
    const inWindow = ref.energies.flat().filter((e) => e !== null && e >= window[0] && e <= window[1]).length;
    const v = buildFitPreview(doc, ref, spec({ parameters: free, window }));
    expect(v.points).toBe(inWindow);
    expect(v.excluded).toBe(all - inWindow);
    const noUpper = buildFitPreview(doc, ref, spec({ parameters: free, bandWeights: [{ band: 1, weight: 0 }] }));
    expect(noUpper.points).toBe(ref.pointCount);
    expect(noUpper.perBand.map((b) => b.referenceBand)).toEqual([0]);
  });

  it("pairs model band n with reference band n + offset (a deep extra band in the reference)", () => {
    const withCore = storedReference(doc, 0, 1, -40);
    const v = buildFitPreview(doc, withCore, spec({ parameters: free, bandOffset: 1 }));
    expect(v.perBand.map((b) => [b.modelBand, b.referenceBand])).toEqual([[0, 1], [1, 2]]);
    expect(v.points).toBe(all);
  });

  it("refuses, before any work, a window with no bands, too few points, bounds excluding the start and unknown keys", () => {
    const refuse = (s: Parameters<typeof spec>[0], message: RegExp) => expect(() => buildFitPreview(doc, ref, spec(s))).toThrow(message);
    refuse({ parameters: free, window: [50, 60] }, /window \[50, 60\] eV holds no reference band energies/);
    refuse({ parameters: [{ key: "onsite/A/s", lower: -3, upper: 0 }] }, /start value -4 of onsite\/A\/s lies outside its bounds \[-3, 0\]/);
    refuse({ parameters: [{ key: "onsite/A/d" }] }, /unknown parameter key "onsite\/A\/d"/);
    const tiny = { ...ref, k: ref.k.slice(0, 1), energies: ref.energies.slice(0, 1), pointCount: 1 };
    expect(() => buildFitPreview(doc, tiny, spec({ parameters: [{ key: "onsite/A/s" }, { key: "onsite/A/pz" }, { key: "shell/A-A/1/ss_sigma" }] }))).toThrow(
      /2 reference points for 3 free parameters; need more points than parameters/,
    );
    expect(() => buildFitPreview(doc, ref, spec({ parameters: free, window: [50, 60] }))).toThrow(FitInputError);
  });

  it("refuses a reference whose k-points do not lie on the model's path", () => {
    const off = { ...ref, k: ref.k.map(([i]) => [i + 10_000]) };
    expect(() => buildFitPreview(doc, off, spec({ parameters: free }))).toThrow(/does not fit this model's k-path/);
  });
});

describe("parameters the fit cannot determine", () => {
  it("names a free parameter that no selected value depends on: pp_pi of a chain along its own axis (no π bond along z)", () => {
    // For neighbours along ±ẑ only, E_z,z = n²V_ppσ + (1 − n²)V_ppπ with n = ±1 (Slater & Koster 1954, Table I): V_ppπ drops out.
    const ref = storedReference(doc);
    const v = buildFitPreview(doc, ref, spec({ parameters: [{ key: "shell/A-A/1/pp_pi" }, { key: "onsite/A/s" }] }));
    expect(v.insensitive).toEqual(["shell/A-A/1/pp_pi"]);
    expect(buildFitPreview(doc, ref, spec({ parameters: free })).insensitive).toEqual([]);
    expect(buildFitPreview(doc, ref, spec({ parameters: free })).undetermined).toBe(false);
  });

  it("names an on-site energy that a least-squares shift takes up (one band: ∂E/∂ε = 1 everywhere), but not without the shift", () => {
    const chain = sChainDocument();
    const ref = storedReference(chain);
    const shifted = buildFitPreview(chain, ref, spec({ parameters: [{ key: "onsite/A/s" }, { key: "shell/A-A/1/ss_sigma" }], alignment: "least-squares" }));
    expect([shifted.insensitive, shifted.undetermined]).toEqual([["onsite/A/s"], true]);
    const plain = buildFitPreview(chain, ref, spec({ parameters: [{ key: "onsite/A/s" }, { key: "shell/A-A/1/ss_sigma" }] }));
    expect([plain.insensitive, plain.undetermined]).toEqual([[], false]);
  });
});
