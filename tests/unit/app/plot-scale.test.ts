import { describe, expect, it } from "vitest";
import { bandPathData, energyExtent, linearScale, niceTicks } from "@/lib/plot/scale";

describe("plot scales", () => {
  it("maps the domain ends onto the range ends, flipped for screen y", () => {
    const y = linearScale([-2, 2], [300, 0]);
    expect(y(-2)).toBe(300);
    expect(y(2)).toBe(0);
    expect(y(0)).toBe(150);
  });
  it("chooses 1–2–5 ticks inside the range", () => {
    expect(niceTicks(-7.3, 4.1, 6)).toEqual([-6, -4, -2, 0, 2, 4]);
    expect(niceTicks(0, 1, 4)).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });
  it("pads the energy extent and ignores missing values", () => {
    expect(energyExtent([[[0, 10]], [[NaN, 5]]], 0.1)).toEqual([-1, 11]);
  });
  it("breaks a band where the path jumps or a value is missing", () => {
    const id = (v: number) => v;
    expect(bandPathData([0, 1, 1, 2], [0, 1, 5, 6], id, id)).toBe("M0.0 0.0L1.0 1.0M1.0 5.0L2.0 6.0");
    expect(bandPathData([0, 1, 2], [0, null, 2], id, id)).toBe("M0.0 0.0M2.0 2.0");
  });
});
