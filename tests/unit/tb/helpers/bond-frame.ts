/**
 * Independent construction of two-centre matrix elements, used to check the Slater–Koster table: each real
 * orbital is written as a polynomial (s: 1, p: x, y, z, d: √3xy, √3yz, √3zx, (√3/2)(x²−y²), z²−(x²+y²)/2, all of
 * equal norm on the unit sphere), re-expanded in a frame whose z' axis is the bond, and paired by |m|: σ, π, δ.
 * Slater & Koster, Phys. Rev. 94, 1498 (1954), §III: the integrals are diagonal in m in the bond frame. The sign for
 * ℓ1 > ℓ2 follows the stated key rule (parity (−1)^(ℓ1+ℓ2) of the swapped pair).
 */
import { ORBITALS, angularMomentum, bondKey, orbitalKind, type BondSymmetry, type Orbital } from "@/lib/tb/orbitals";

type M3 = number[][];
const S3 = Math.sqrt(3);
const sym = (i: number, j: number, v: number): M3 => {
  const m = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  m[i][j] += v;
  m[j][i] += v;
  return m;
};
const D_FORMS: Record<string, M3> = {
  dxy: sym(0, 1, S3 / 2),
  dyz: sym(1, 2, S3 / 2),
  dzx: sym(2, 0, S3 / 2),
  "dx2-y2": [[S3 / 2, 0, 0], [0, -S3 / 2, 0], [0, 0, 0]],
  dz2: [[-0.5, 0, 0], [0, -0.5, 0], [0, 0, 1]],
};
const P_AXIS: Record<string, number> = { px: 0, py: 1, pz: 2 };

/** Bond-frame component label → symmetry; components with the same label pair up. */
const COMPONENT_M: Record<string, BondSymmetry> = { s: "sigma", pz: "sigma", dz2: "sigma", px: "pi", dzx: "pi", py: "pi", dyz: "pi", "dx2-y2": "delta", dxy: "delta" };
const PARTNER: Record<string, string> = { s: "σ", pz: "σ", dz2: "σ", px: "πc", dzx: "πc", py: "πs", dyz: "πs", "dx2-y2": "δc", dxy: "δs" };

function frame(c: number[]): M3 {
  const e3 = c;
  const trial = Math.abs(c[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const dotp = trial.reduce((s, x, i) => s + x * e3[i], 0);
  let e1 = trial.map((x, i) => x - dotp * e3[i]);
  const n1 = Math.hypot(...e1);
  e1 = e1.map((x) => x / n1);
  const e2 = [e3[1] * e1[2] - e3[2] * e1[1], e3[2] * e1[0] - e3[0] * e1[2], e3[0] * e1[1] - e3[1] * e1[0]];
  return [0, 1, 2].map((i) => [e1[i], e2[i], e3[i]]); // columns are the bond-frame axes
}

/** Components of orbital o (crystal frame) on the bond-frame orbitals of the same ℓ. */
function components(o: Orbital, q: M3): Record<string, number> {
  const kind = orbitalKind(o);
  if (kind === "s" || kind === "s*") return { s: 1 };
  if (kind === "p") return { px: q[P_AXIS[o]][0], py: q[P_AXIS[o]][1], pz: q[P_AXIS[o]][2] };
  const m = D_FORMS[o];
  const rot = [0, 1, 2].map((i) => [0, 1, 2].map((j) => [0, 1, 2].reduce((s, a) => s + [0, 1, 2].reduce((t, b) => t + q[a][i] * m[a][b] * q[b][j], 0), 0)));
  const out: Record<string, number> = {};
  for (const [name, basis] of Object.entries(D_FORMS)) {
    const num = [0, 1, 2].reduce((s, i) => s + [0, 1, 2].reduce((t, j) => t + basis[i][j] * rot[i][j], 0), 0);
    out[name] = num / 1.5; // every form has Frobenius norm² 3/2
  }
  return out;
}

export function bondFrameElement(o1: Orbital, o2: Orbital, c: number[], integral: (key: string) => number): number {
  const q = frame(c);
  const c1 = components(o1, q), c2 = components(o2, q);
  const k1 = orbitalKind(o1), k2 = orbitalKind(o2);
  const sign = angularMomentum(k1) > angularMomentum(k2) && (angularMomentum(k1) + angularMomentum(k2)) % 2 === 1 ? -1 : 1;
  let sum = 0;
  for (const [b1, x1] of Object.entries(c1)) {
    for (const [b2, x2] of Object.entries(c2)) {
      if (PARTNER[b1] !== PARTNER[b2]) continue;
      sum += x1 * x2 * integral(bondKey(k1, k2, COMPONENT_M[b1]));
    }
  }
  return sign * sum;
}

export const ALL_ORBITALS: readonly Orbital[] = ORBITALS;
