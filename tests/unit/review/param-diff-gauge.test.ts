import { describe, expect, it } from "vitest";
import { buildParameterDiff } from "@/lib/review/param-diff";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { monkhorstPackMesh } from "@/lib/tb/analysis/mesh";
import { zincBlendeDocument } from "../tb/analysis/documents";

// Multiplying every orbital of one kind on one species by −1 is a diagonal unitary change of basis: the eigenvalues
// stay and each two-centre integral picks up the product of its two orbitals' signs (Slater & Koster, Phys. Rev. 94,
// 1498 (1954): the integrals are defined between orbitals of fixed phase). The bands are recomputed here on the path
// and on a shifted 5×5×5 mesh, independently of the diff's own check.

function largestBandChange(a: ModelDocument, b: ModelDocument): number {
  const k = [...samplePath(a).kFrac, ...monkhorstPackMesh([5, 5, 5]).kFrac.map((q) => q.map((x) => x + 0.013))];
  const ea = computeBands(compileModel(a), k).energies;
  const eb = computeBands(compileModel(b), k).energies;
  let max = 0;
  ea.forEach((levels, i) => levels.forEach((e, n) => (max = Math.max(max, Math.abs(e - eb[i][n])))));
  return max;
}

describe("gauge verdict of the parameter diff", () => {
  it("calls p → −p on both species (sp_sigma and ps_sigma flipped together) no physical change, with unchanged bands", () => {
    const base = zincBlendeDocument();
    const proposed = zincBlendeDocument({ sp_sigma: -2.1, ps_sigma: -2.4 });
    const diff = buildParameterDiff(base, proposed);
    expect(diff.gauge.verdict).toBe("no physical change");
    expect(diff.gauge.explanation).toMatch(/every p orbital on A.*every p orbital on B/);
    expect(diff.rows.map((r) => [r.key, r.signFlip]).sort()).toEqual([["shell/A-B/1/ps_sigma", true], ["shell/A-B/1/sp_sigma", true]]);
    expect(largestBandChange(base, proposed)).toBeLessThan(1e-10);
  });

  it("calls p → −p on one species (its sp_sigma, pp_sigma and pp_pi flipped) no physical change", () => {
    const base = zincBlendeDocument();
    const proposed = zincBlendeDocument({ sp_sigma: -2.1, pp_sigma: -3.0, pp_pi: 0.8 });
    const diff = buildParameterDiff(base, proposed);
    expect(diff.gauge.verdict).toBe("no physical change");
    expect(diff.gauge.explanation).toMatch(/every p orbital on B/);
    expect(diff.rows.every((r) => r.signFlip)).toBe(true);
    expect(largestBandChange(base, proposed)).toBeLessThan(1e-10);
  });

  it("calls a sign flip of pp_pi alone a physical change, and the bands move", () => {
    const base = zincBlendeDocument();
    const proposed = zincBlendeDocument({ pp_pi: 0.8 });
    const diff = buildParameterDiff(base, proposed);
    expect(diff.gauge.verdict).toBe("physical change");
    expect(diff.rows).toHaveLength(1);
    expect(diff.rows[0]).toMatchObject({ key: "shell/A-B/1/pp_pi", signFlip: true });
    const moved = largestBandChange(base, proposed);
    expect(moved).toBeGreaterThan(0.1);
    expect(diff.rows[0].effect).toBeGreaterThan(0.1);
  });

  it("does not excuse a phase change that comes with a new electron count", () => {
    const base = zincBlendeDocument();
    const proposed = { ...zincBlendeDocument({ sp_sigma: -2.1, ps_sigma: -2.4 }), electronCount: 6 };
    const diff = buildParameterDiff(base, proposed);
    expect(diff.gauge.verdict).toBe("physical change");
    expect(diff.gauge.explanation).toMatch(/electron count changed \(8 → 6\)/);
  });
});
