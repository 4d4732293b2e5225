/**
 * Two-centre matrix elements ⟨o1 on atom a|H|o2 on atom b⟩ for a bond a → b with direction cosines (l, m, n).
 * Source: J. C. Slater and G. F. Koster, Phys. Rev. 94, 1498 (1954), Table I (s, p and d entries; entries not
 * printed there follow from the cyclic permutation x→y→z, l→m→n, as the paper prescribes).
 * Key rule (see conventions.ts): the integral named <t1><t2>_<m> has t1 on the FROM atom. When o1 has the
 * higher angular momentum, ⟨o1_a|H|o2_b⟩ = (−1)^(ℓ1+ℓ2) E_{o2,o1}(l, m, n) evaluated with the integrals of key
 * <kind(o1)><kind(o2)>, e.g. ⟨px_a|H|s_b⟩ = −l·ps_sigma.
 */
import { angularMomentum, bondKey, orbitalKind, type BondSymmetry, type Orbital } from "./orbitals";

type V = (m: BondSymmetry) => number;
const S3 = Math.sqrt(3);

const P_AXIS: Record<string, 0 | 1 | 2> = { px: 0, py: 1, pz: 2 };
const T2G = ["dxy", "dyz", "dzx"] as const;

/** Rotate (l, m, n) cyclically `shift` times: 1 → (m, n, l), 2 → (n, l, m). */
function cyc(c: [number, number, number], shift: number): [number, number, number] {
  return shift === 0 ? c : shift === 1 ? [c[1], c[2], c[0]] : [c[2], c[0], c[1]];
}

function sD(o: Orbital, [l, m, n]: [number, number, number], v: V): number {
  const s = v("sigma");
  switch (o) {
    case "dxy": return S3 * l * m * s;
    case "dyz": return S3 * m * n * s;
    case "dzx": return S3 * n * l * s;
    case "dx2-y2": return 0.5 * S3 * (l * l - m * m) * s;
    default: return (n * n - 0.5 * (l * l + m * m)) * s;
  }
}

/** x–xy, x–yz, x–zx of Table I; the other p–t2g entries by cyclic permutation. */
function pT2g(axis: number, d: number, c: [number, number, number], v: V): number {
  const rel = (d - axis + 3) % 3; // 0: x–xy type, 1: x–yz type, 2: x–zx type
  const [l, m, n] = cyc(c, axis);
  const s = v("sigma"), p = v("pi");
  if (rel === 0) return S3 * l * l * m * s + m * (1 - 2 * l * l) * p;
  if (rel === 1) return S3 * l * m * n * s - 2 * l * m * n * p;
  return S3 * l * l * n * s + n * (1 - 2 * l * l) * p;
}

function pEg(axis: number, o: Orbital, [l, m, n]: [number, number, number], v: V): number {
  const s = v("sigma"), p = v("pi");
  const lm = l * l - m * m;
  const z2 = n * n - 0.5 * (l * l + m * m);
  if (o === "dx2-y2") {
    if (axis === 0) return 0.5 * S3 * l * lm * s + l * (1 - lm) * p;
    if (axis === 1) return 0.5 * S3 * m * lm * s - m * (1 + lm) * p;
    return 0.5 * S3 * n * lm * s - n * lm * p;
  }
  if (axis === 0) return l * z2 * s - S3 * l * n * n * p;
  if (axis === 1) return m * z2 * s - S3 * m * n * n * p;
  return n * z2 * s + S3 * n * (l * l + m * m) * p;
}

function t2gT2g(a: number, b: number, c: [number, number, number], v: V): number {
  const s = v("sigma"), p = v("pi"), d = v("delta");
  if (a === b) {
    const [l, m, n] = cyc(c, a);
    return 3 * l * l * m * m * s + (l * l + m * m - 4 * l * l * m * m) * p + (n * n + l * l * m * m) * d;
  }
  const first = (b - a + 3) % 3 === 1 ? a : b; // (xy,yz), (yz,zx), (zx,xy) share one formula
  const [l, m, n] = cyc(c, first);
  return 3 * l * m * m * n * s + l * n * (1 - 4 * m * m) * p + l * n * (m * m - 1) * d;
}

function t2gEg(a: number, o: Orbital, [l, m, n]: [number, number, number], v: V): number {
  const s = v("sigma"), p = v("pi"), d = v("delta");
  const lm = l * l - m * m;
  const z2 = n * n - 0.5 * (l * l + m * m);
  if (o === "dx2-y2") {
    if (a === 0) return 1.5 * l * m * lm * s + 2 * l * m * -lm * p + 0.5 * l * m * lm * d;
    if (a === 1) return 1.5 * m * n * lm * s - m * n * (1 + 2 * lm) * p + m * n * (1 + 0.5 * lm) * d;
    return 1.5 * n * l * lm * s + n * l * (1 - 2 * lm) * p - n * l * (1 - 0.5 * lm) * d;
  }
  if (a === 0) return S3 * l * m * z2 * s - 2 * S3 * l * m * n * n * p + 0.5 * S3 * l * m * (1 + n * n) * d;
  if (a === 1) return S3 * m * n * z2 * s + S3 * m * n * (l * l + m * m - n * n) * p - 0.5 * S3 * m * n * (l * l + m * m) * d;
  return S3 * l * n * z2 * s + S3 * l * n * (l * l + m * m - n * n) * p - 0.5 * S3 * l * n * (l * l + m * m) * d;
}

function egEg(a: Orbital, b: Orbital, [l, m, n]: [number, number, number], v: V): number {
  const s = v("sigma"), p = v("pi"), d = v("delta");
  const lm = l * l - m * m;
  const z2 = n * n - 0.5 * (l * l + m * m);
  if (a === "dx2-y2" && b === "dx2-y2") return 0.75 * lm * lm * s + (l * l + m * m - lm * lm) * p + (n * n + 0.25 * lm * lm) * d;
  if (a === "dz2" && b === "dz2") return z2 * z2 * s + 3 * n * n * (l * l + m * m) * p + 0.75 * (l * l + m * m) ** 2 * d;
  return 0.5 * S3 * lm * z2 * s + S3 * n * n * -lm * p + 0.25 * S3 * (1 + n * n) * lm * d;
}

/** Table I entry E_{o1,o2} for ℓ(o1) ≤ ℓ(o2), with the integrals supplied by `v`. */
function tableEntry(o1: Orbital, o2: Orbital, c: [number, number, number], v: V): number {
  const k1 = orbitalKind(o1), k2 = orbitalKind(o2);
  if (k2 === "s" || k2 === "s*") return v("sigma");
  if (k2 === "p") {
    const b = P_AXIS[o2];
    if (k1 !== "p") return c[b] * v("sigma");
    const a = P_AXIS[o1];
    return c[a] * c[b] * (v("sigma") - v("pi")) + (a === b ? v("pi") : 0);
  }
  const t2 = T2G.indexOf(o2 as (typeof T2G)[number]);
  if (k1 !== "p" && k1 !== "d") return sD(o2, c, v);
  if (k1 === "p") return t2 >= 0 ? pT2g(P_AXIS[o1], t2, c, v) : pEg(P_AXIS[o1], o2, c, v);
  const t1 = T2G.indexOf(o1 as (typeof T2G)[number]);
  if (t1 >= 0 && t2 >= 0) return t2gT2g(t1, t2, c, v);
  if (t1 >= 0) return t2gEg(t1, o2, c, v);
  if (t2 >= 0) return t2gEg(t2, o1, c, v);
  return egEg(o1, o2, c, v);
}

/**
 * ⟨o1_a|H|o2_b⟩ for bond direction cosines `c` (unit vector from a to b); `integral(key)` returns the
 * two-centre integral for a key such as "ps_sigma" (t1 on atom a).
 */
export function slaterKosterElement(
  o1: Orbital,
  o2: Orbital,
  c: [number, number, number],
  integral: (key: string) => number,
): number {
  const k1 = orbitalKind(o1), k2 = orbitalKind(o2);
  const v: V = (m) => integral(bondKey(k1, k2, m));
  const l1 = angularMomentum(k1), l2 = angularMomentum(k2);
  if (l1 <= l2) return tableEntry(o1, o2, c, v);
  return ((l1 + l2) % 2 === 0 ? 1 : -1) * tableEntry(o2, o1, c, v);
}
