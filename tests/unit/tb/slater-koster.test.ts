import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { BOND_KEYS } from "@/lib/tb/orbitals";
import { slaterKosterElement } from "@/lib/tb/slater-koster";
import { ALL_ORBITALS, bondFrameElement } from "./helpers/bond-frame";
import { buildDocument, FCC } from "./helpers/build-document";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";

const rand = seededUniform(1954);
const integrals: Record<string, number> = Object.fromEntries(BOND_KEYS.map((k) => [k, rand() * 4 - 2]));
const integral = (k: string) => integrals[k];

function randomDirection(): [number, number, number] {
  const v = [rand() - 0.5, rand() - 0.5, rand() - 0.5];
  const n = Math.hypot(...v);
  return v.map((x) => x / n) as [number, number, number];
}

describe("Slater–Koster table (Slater & Koster, Phys. Rev. 94, 1498 (1954), Table I)", () => {
  it("matches the bond-frame construction for every orbital pair, s/p/d/s*, in random directions", () => {
    for (let trial = 0; trial < 25; trial++) {
      const c = randomDirection();
      for (const o1 of ALL_ORBITALS) {
        for (const o2 of ALL_ORBITALS) {
          expect(slaterKosterElement(o1, o2, c, integral), `${o1}–${o2} at ${c}`).toBeCloseTo(bondFrameElement(o1, o2, c, integral), 12);
        }
      }
    }
  });

  it("follows the key rule: ⟨s_a|H|px_b⟩ = l·sp_sigma and ⟨px_a|H|s_b⟩ = −l·ps_sigma", () => {
    const c: [number, number, number] = [0.6, 0.0, 0.8];
    const v = (k: string) => ({ sp_sigma: 2, ps_sigma: 3 })[k] ?? 0;
    expect(slaterKosterElement("s", "px", c, v)).toBeCloseTo(0.6 * 2, 14);
    expect(slaterKosterElement("px", "s", c, v)).toBeCloseTo(-0.6 * 3, 14);
  });

  it("gives the pure σ, π, δ integrals for a bond along z (Table I at n = 1)", () => {
    const z: [number, number, number] = [0, 0, 1];
    expect(slaterKosterElement("dz2", "dz2", z, integral)).toBeCloseTo(integrals.dd_sigma, 14);
    expect(slaterKosterElement("dzx", "dzx", z, integral)).toBeCloseTo(integrals.dd_pi, 14);
    expect(slaterKosterElement("dxy", "dxy", z, integral)).toBeCloseTo(integrals.dd_delta, 14);
    expect(slaterKosterElement("dx2-y2", "dx2-y2", z, integral)).toBeCloseTo(integrals.dd_delta, 14);
    expect(slaterKosterElement("px", "dzx", z, integral)).toBeCloseTo(integrals.pd_pi, 14);
    expect(slaterKosterElement("pz", "dz2", z, integral)).toBeCloseTo(integrals.pd_sigma, 14);
    expect(slaterKosterElement("s*", "dz2", z, integral)).toBeCloseTo(integrals["s*d_sigma"], 14);
  });

  it("gives rotation-invariant eigenvalues for a whole two-species s/p/d/s* crystal", () => {
    // A rigid rotation of the crystal leaves the spectrum at the same fractional k unchanged (the SK form is
    // built to be rotation covariant: Slater & Koster 1954, §III).
    const all = ["s", "px", "py", "pz", "dxy", "dyz", "dzx", "dx2-y2", "dz2", "s*"] as const;
    const a = 5.2;
    const params = Object.fromEntries(BOND_KEYS.map((k) => [k, rand() * 2 - 1]));
    // on-site energies equal within each shell, as rotation invariance requires
    const shellEnergy = { s: -3.1, p: 1.2, d: -0.4, "s*": 4.5 };
    const onsite = Object.fromEntries(all.map((o) => [o, shellEnergy[o === "s" || o === "s*" ? o : o[0] === "p" ? "p" : "d"]]));
    const base = (rot: (v: number[]) => number[]): ModelDocument =>
      buildDocument({
        lattice: { dimension: 3, vectors: FCC(a).map(rot) as [number, number, number][] },
        sites: [
          { label: "A1", species: "A", position: rot([0, 0, 0]) as [number, number, number], orbitals: [...all] },
          { label: "B1", species: "B", position: rot([a / 4, a / 4, a / 4]) as [number, number, number], orbitals: [...all] },
        ],
        onsite: { A: onsite, B: { ...onsite, s: 0.3 } },
        shells: [{ species: ["A", "B"], index: 1, distance: (a * Math.sqrt(3)) / 4, params }],
      });
    const [ax, ay, az] = randomDirection();
    const th = 0.917;
    const [c, s] = [Math.cos(th), Math.sin(th)];
    // Rodrigues' rotation formula about the unit axis (ax, ay, az)
    const R = [
      [c + ax * ax * (1 - c), ax * ay * (1 - c) - az * s, ax * az * (1 - c) + ay * s],
      [ay * ax * (1 - c) + az * s, c + ay * ay * (1 - c), ay * az * (1 - c) - ax * s],
      [az * ax * (1 - c) - ay * s, az * ay * (1 - c) + ax * s, c + az * az * (1 - c)],
    ];
    const rotate = (v: number[]) => R.map((row) => row[0] * v[0] + row[1] * v[1] + row[2] * v[2]);
    const ks = [[0, 0, 0], [0.5, 0, 0.5], [0.21, 0.37, -0.11], [0.5, 0.25, 0.75]];
    const e0 = computeBands(compileModel(parseModelDocument(base((v) => v))), ks).energies;
    const e1 = computeBands(compileModel(parseModelDocument(base(rotate))), ks).energies;
    e0.forEach((e, i) => e.forEach((x, j) => expect(e1[i][j]).toBeCloseTo(x, 10)));
  });
});
