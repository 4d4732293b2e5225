import { describe, expect, it } from "vitest";
import type { ModelDocument } from "@/lib/tb/document";
import { computeBands } from "@/lib/tb/bands";
import { compileModel } from "@/lib/tb/model";
import { runDocumentChecks } from "@/lib/tb/analysis/checks";
import type { CheckResult } from "@/lib/tb/analysis/check-result";
import { checkHermiticity, checkTimeReversal, checkTraceSumRule } from "@/lib/tb/analysis/checks-symmetry";
import { checkOutermostShell } from "@/lib/tb/analysis/checks-shells";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { honeycombDocument, spChainDocument, zincBlendeDocument } from "./documents";

const byId = (results: CheckResult[], id: string): CheckResult => {
  const found = results.find((r) => r.id === id);
  if (!found) throw new Error(`no check ${id}`);
  return found;
};

describe("document checks", () => {
  it("pass for a valid zinc-blende sp3 model, with the trace sum rule at Σ on-site energies", () => {
    const results = runDocumentChecks(zincBlendeDocument(), { degeneracies: [{ point: "Γ", bands: [1, 2, 3] }] });
    for (const id of ["hermiticity", "time-reversal", "trace-sum-rule", "declared-degeneracies", "hopping-decay", "outermost-shell"]) {
      expect(byId(results, id).status, id).toBe("pass");
    }
    // Σ on-site by hand: A (−8.3 + 3·1.0) + B (−2.7 + 3·3.6) = 2.8 eV; Tr H(k) averages to it (phases average out).
    expect(byId(results, "trace-sum-rule").detail).toMatch(/Σ on-site = 2\.80000/);
  });

  it("fails a declared degeneracy that does not hold (Γ: s-like band 0 is not degenerate with the p triplet, Td symmetry)", () => {
    // Zinc-blende Γ: Γ1 (s-like) singlet and Γ15 (p-like) triplet; Dresselhaus, Phys. Rev. 100, 580 (1955).
    const results = runDocumentChecks(zincBlendeDocument(), { degeneracies: [{ point: "Γ", bands: [0, 1] }, { point: "Q", bands: [0, 1] }] });
    const d = byId(results, "declared-degeneracies");
    expect(d.status).toBe("fail");
    expect(d.detail).toMatch(/Γ: bands 0, 1 spread/);
    expect(d.detail).toMatch(/Q: no such point/);
  });

  it("flags a non-Hermitian matrix and a broken E(k) = E(−k)", () => {
    const n = 2;
    const bad = { re: Float64Array.of(1, 0.5, 0.4, 2), im: new Float64Array(4) };
    expect(checkHermiticity(n, [bad]).status).toBe("fail");
    const odd = (k: number[]) => Float64Array.of(Math.sin(2 * Math.PI * k[0]));
    expect(checkTimeReversal(odd, [[0.1]], false).status).toBe("fail");
    expect(checkTimeReversal(odd, [[0.1]], true).status).toBe("warn");
  });

  it("warns instead of failing when complex hoppings break time reversal (Haldane, Phys. Rev. Lett. 61, 2015 (1988))", () => {
    const doc: ModelDocument = structuredClone(honeycombDocument());
    doc.hoppings = [
      { from: { site: "C1", orbital: "pz" }, to: { site: "C1", orbital: "pz" }, translation: [1, 0], value: { re: 0, im: 0.1 } },
      { from: { site: "C1", orbital: "pz" }, to: { site: "C1", orbital: "pz" }, translation: [-1, 1], value: { re: 0, im: 0.1 } },
      { from: { site: "C1", orbital: "pz" }, to: { site: "C1", orbital: "pz" }, translation: [0, -1], value: { re: 0, im: 0.1 } },
    ];
    const results = runDocumentChecks(doc);
    expect(byId(results, "time-reversal").status).toBe("warn");
    expect(byId(results, "hermiticity").status).toBe("pass");
    expect(byId(results, "trace-sum-rule").status).toBe("pass");
  });

  it("fails the trace sum rule when the levels do not average to the on-site sum", () => {
    const shifted = (k: number[]) => Float64Array.of(0.1 + Math.cos(2 * Math.PI * k[0]));
    expect(checkTraceSumRule(shifted, monkhorstPackMesh([8]), 0).status).toBe("fail");
    expect(checkTraceSumRule(shifted, monkhorstPackMesh([8]), 0.1).status).toBe("pass");
  });

  it("warns when a farther shell is stronger than a nearer one", () => {
    expect(byId(runDocumentChecks(spChainDocument()), "hopping-decay").status).toBe("pass");
    const res = byId(runDocumentChecks(spChainDocument({ pp2: 2.5 })), "hopping-decay");
    expect(res.status).toBe("warn");
    expect(res.measured).toBeCloseTo(2.5 / 1.8, 10);
  });

  it("measures the largest shift from dropping the outermost shell (same as zeroing its integrals)", () => {
    const doc = spChainDocument();
    const k = Array.from({ length: 21 }, (_, i) => [i / 40]);
    const res = checkOutermostShell(doc, k, undefined, 10);
    const zeroed = computeBands(compileModel(spChainDocument({ ss2: 0, sp2: 0, pp2: 0 })), k).energies;
    const full = computeBands(compileModel(doc), k).energies;
    const expected = Math.max(...full.flatMap((row, i) => Array.from(row, (e, n) => Math.abs(e - zeroed[i][n]))));
    expect(res.measured).toBeCloseTo(expected, 12);
    expect(res.measured).toBeGreaterThan(0.1);
    expect(res.status).toBe("pass");
    expect(checkOutermostShell(doc, k, undefined, 0.01).status).toBe("warn");
  });

  it("keeps time reversal and the trace rule with spin–orbit (Kramers; L·S is traceless), and catches unequal sp/ps in one species", () => {
    const soc = runDocumentChecks(zincBlendeDocument({}, { A: 0.12, B: 0.34 }));
    for (const id of ["hermiticity", "time-reversal", "trace-sum-rule"]) expect(byId(soc, id).status, id).toBe("pass");
    // Σ on-site, both spin blocks: 2 × 2.8 eV.
    expect(byId(soc, "trace-sum-rule").detail).toMatch(/Σ on-site = 5\.60000/);
    const bad: ModelDocument = structuredClone(spChainDocument());
    bad.shells[0].params.ps_sigma = 0.4;
    expect(byId(runDocumentChecks(bad), "hermiticity").status).toBe("fail");
  });
});
