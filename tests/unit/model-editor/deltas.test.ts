import { describe, expect, it } from "vitest";
import chain from "@/db/seed/models/demo-sp-chain.json";
import { setAt, type Draft } from "@/app/_components/model-editor/draft-path";
import { changedParameterKeys } from "@/app/_components/model-editor/parameter-keys";
import { fieldChange, formatDelta } from "@/app/_components/model-editor/deltas";
import { parseNumberText } from "@/app/_components/model-editor/number-text";

const base = structuredClone(chain) as unknown as Draft;

describe("Δ against the base document", () => {
  it("gives the signed difference of a changed number and nothing for an unchanged one", () => {
    const draft = setAt(base, ["onsite", "A", "pz"], 1.25);
    expect(fieldChange(draft, base, ["onsite", "A", "pz"])).toEqual({ kind: "changed", delta: -0.25 });
    expect(fieldChange(draft, base, ["onsite", "A", "s"])).toEqual({ kind: "same" });
  });
  it("matches shells by species pair and index, so a shell inserted in front does not mark the old one changed", () => {
    const inserted = { species: ["A", "A"], index: 2, distance: 5, params: { ss_sigma: -0.1 } };
    const draft = setAt(base, ["shells"], [inserted, (base.shells as unknown[])[0]]);
    expect(fieldChange(draft, base, ["shells", 1, "params", "sp_sigma"])).toEqual({ kind: "same" });
    expect(fieldChange(draft, base, ["shells", 0, "params", "ss_sigma"])).toEqual({ kind: "new" });
  });
  it("marks nothing when there is no base (a blank model)", () => {
    expect(fieldChange(base, null, ["onsite", "A", "s"])).toEqual({ kind: "same" });
  });
  it("lists exactly the parameters whose value moved as needing a citation", () => {
    const draft = setAt(setAt(base, ["shells", 0, "params", "pp_pi"], 0.3), ["electronCount"], 1);
    expect(changedParameterKeys(draft, base)).toEqual(["shell/A-A/1/pp_pi"]);
    expect(changedParameterKeys(base, null)).toHaveLength(6);
  });
  it("formats Δ with its sign and a true minus; 1.6 → 1.7 reads +0.100 despite binary rounding", () => {
    expect(formatDelta(1.7 - 1.6)).toBe("+0.100");
    expect(formatDelta(-2)).toBe("−2.000");
    expect(formatDelta(-2.5e-5)).toBe("−2.50e-5");
  });
});

describe("typed numbers", () => {
  it("reads numbers, a typographic minus and exponents; keeps half-typed text so the validator flags it", () => {
    expect(parseNumberText("−1.5")).toBe(-1.5);
    expect(parseNumberText("2e-3")).toBe(0.002);
    expect(parseNumberText("1.")).toBe(1);
    expect(parseNumberText("-")).toBe("-");
    expect(parseNumberText("")).toBe("");
    expect(parseNumberText(" ", true)).toBeUndefined();
    expect(parseNumberText("1e999")).toBe("1e999");
  });
});
