import { describe, expect, it } from "vitest";
import { buildParameterDiff } from "@/lib/review/param-diff";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { setParameters } from "@/lib/tb/parameters";
import { sChainDocument, zincBlendeDocument } from "../tb/analysis/documents";

// The effect column against an independent exact recompute: bands of both documents, largest |ΔE| over the base
// bands inside the window. To first order ΔE = (∂E/∂p)Δp with ∂E/∂p = ⟨ψ|∂H/∂p|ψ⟩ (Hellmann–Feynman theorem:
// Feynman, Phys. Rev. 56, 340 (1939)), so the estimate differs from the exact shift by O(Δp²).

const K = 80;

function exactShift(base: ModelDocument, proposed: ModelDocument, window: [number, number]): number {
  const k = samplePath(base, K).kFrac;
  const a = computeBands(compileModel(base), k).energies;
  const b = computeBands(compileModel(proposed), k).energies;
  let max = 0;
  a.forEach((levels, i) => levels.forEach((e, n) => {
    if (e >= window[0] && e <= window[1]) max = Math.max(max, Math.abs(b[i][n] - e));
  }));
  return max;
}

describe("effect column", () => {
  it("matches the analytic s-chain shift inside a window (E = ε + 2t·cos 2πk; Ashcroft & Mermin (1976), ch. 10)", () => {
    const base = sChainDocument(0.5, -1);
    const window: [number, number] = [-1, 1];
    const dt = -0.05;
    const row = buildParameterDiff(base, sChainDocument(0.5, -1 + dt), { window, kPoints: K }).rows[0];
    // The band is linear in t, so first order is exact here: max |2δt·cos 2πk| over path points with E(k) in the window.
    let expected = 0;
    for (const [k] of samplePath(base, K).kFrac) {
      const e = 0.5 - 2 * Math.cos(2 * Math.PI * k);
      if (e >= window[0] && e <= window[1]) expected = Math.max(expected, Math.abs(2 * dt * Math.cos(2 * Math.PI * k)));
    }
    expect(expected).toBeGreaterThan(0.05);
    expect(expected).toBeLessThan(0.0751);
    expect(row.effect).toBeCloseTo(expected, 12);
  });

  it("first order agrees with the exact recompute to O(Δp²) for small changes of a zinc-blende sp3 model", () => {
    const base = zincBlendeDocument();
    const window: [number, number] = [-20, 6];
    const keys = ["shell/A-B/1/pp_sigma", "shell/A-B/1/sp_sigma", "onsite/A/s", "shell/A-B/1/pp_pi"];
    const errorAt = (h: number) => {
      const values = Object.fromEntries(keys.map((key, i) => [key, setValue(base, key) + h * (i + 1)]));
      const diff = buildParameterDiff(base, setParameters(base, values), { window, exactRows: 0, kPoints: K });
      return keys.map((key) => {
        const row = diff.rows.find((r) => r.key === key);
        expect(row?.effectMethod).toBe("first-order");
        const exact = exactShift(base, setParameters(base, { [key]: values[key] }), window);
        expect(exact).toBeGreaterThan(0);
        return Math.abs((row?.effect ?? NaN) - exact);
      });
    };
    const coarse = errorAt(2e-3);
    const fine = errorAt(1e-3);
    coarse.forEach((err, i) => {
      const dp = 2e-3 * (i + 1);
      expect(err).toBeLessThan(10 * dp * dp);
      // Halving Δp cuts a second-order error by about four (one-sided first-order terms cancel exactly).
      if (err > 1e-9) expect(fine[i]).toBeLessThan(err / 3);
    });
  });

  it("recomputes the largest rows exactly: equal to the bands of both documents", () => {
    const base = zincBlendeDocument();
    const window: [number, number] = [-20, 6];
    const proposed = setParameters(base, { "shell/A-B/1/ss_sigma": -1.5 });
    const [row] = buildParameterDiff(base, proposed, { window, kPoints: K }).rows;
    expect(row.effectMethod).toBe("exact");
    expect(row.effect).toBeCloseTo(exactShift(base, proposed, window), 12);
    const [estimate] = buildParameterDiff(base, proposed, { window, exactRows: 0, kPoints: K }).rows;
    expect(estimate.effectMethod).toBe("first-order");
    // A 0.2 eV change of ss_sigma is not small: the estimate is near but not equal.
    expect(Math.abs((estimate.effect ?? 0) - (row.effect ?? 0))).toBeGreaterThan(1e-6);
    expect(Math.abs((estimate.effect ?? 0) - (row.effect ?? 0))).toBeLessThan(0.2 * (row.effect ?? 0));
  });

  it("measures nothing outside the window", () => {
    const base = sChainDocument(0.5, -1);
    const [row] = buildParameterDiff(base, sChainDocument(0.6, -1), { window: [10, 20] }).rows;
    expect(row.effect).toBe(0);
  });
});

function setValue(doc: ModelDocument, key: string): number {
  const parts = key.split("/");
  return parts[0] === "onsite" ? doc.onsite[parts[1]][parts[2]] : doc.shells[0].params[parts[3]];
}
