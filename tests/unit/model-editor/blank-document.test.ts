import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { validateModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { blankModelDocument } from "@/lib/tb/blank-document";

describe("blank model document", () => {
  for (const dimension of [1, 2, 3] as const) {
    it(`is valid in ${dimension}D and passes the engine's validator with no errors`, () => {
      const report = validateModelDocument(blankModelDocument(dimension));
      expect(report.errors).toEqual([]);
      expect(report.document?.lattice.dimension).toBe(dimension);
    });
    it(`gives the analytic s band at Γ and at the zone corner in ${dimension}D`, () => {
      // One s orbital with nearest-neighbour hopping V on a simple (hyper)cubic lattice: E(k) = ε + 2V Σ_i cos(k_i a),
      // so E(Γ) = ε + 2dV and E(π/a, …) = ε − 2dV (Ashcroft & Mermin, Solid State Physics, 1976, ch. 10, s-band
      // example for the simple cubic lattice; recalled from memory).
      const doc = blankModelDocument(dimension);
      const v = doc.shells[0].params.ss_sigma;
      const eps = doc.onsite.A.s;
      const corner = new Array<number>(dimension).fill(0.5);
      const { energies } = computeBands(compileModel(doc), [new Array<number>(dimension).fill(0), corner]);
      expect(energies[0][0]).toBeCloseTo(eps + 2 * dimension * v, 12);
      expect(energies[1][0]).toBeCloseTo(eps - 2 * dimension * v, 12);
    });
  }
  it("returns an independent copy each time", () => {
    const a = blankModelDocument(2);
    a.lattice.vectors[0][0] = 9;
    expect(blankModelDocument(2).lattice.vectors[0][0]).toBe(2.5);
  });
});
