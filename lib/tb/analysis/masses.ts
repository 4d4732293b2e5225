import { HBAR2_OVER_ME, type EnergySolver } from "./constants";
import { kCartToFrac } from "./k-geometry";

/**
 * Effective mass of one band at a k-point along a Cartesian direction, from the curvature
 * m* / mₑ = (ħ²/mₑ) / (d²E/dk²) with ħ²/mₑ = 7.61996 eV·Å² (CODATA 2018).
 * d²E/dk² by the three-point central difference (E(k+h) − 2E(k) + E(k−h)) / h², truncation error h²·E''''/12;
 * default step h = 0.01 Å⁻¹, about 1% of a typical zone and far above round-off (ε·E/h² ≈ 1e-11 eV·Å²).
 * At a maximum the curvature and so the mass is negative: a hole-like extremum with hole mass |m*|.
 */
export const DEFAULT_MASS_STEP = 0.01;

export interface MassOptions {
  band: number;
  kFrac: ArrayLike<number>;
  /** Cartesian direction (normalised here), same components as the reciprocal rows. */
  direction: number[];
  reciprocal: number[][];
  /** Finite-difference step in Å⁻¹. */
  step?: number;
}

export interface MassResult {
  band: number;
  direction: number[];
  /** d²E/dk², eV·Å². */
  curvature: number;
  /** m* / mₑ; ±Infinity for a flat band. */
  massRatio: number;
  carrier: "electron-like" | "hole-like" | "flat";
  step: number;
}

export function computeEffectiveMass(solve: EnergySolver, opts: MassOptions): MassResult {
  const h = opts.step ?? DEFAULT_MASS_STEP;
  if (!(h > 0)) throw new Error("masses: step must be positive");
  const norm = Math.hypot(...opts.direction);
  if (!(norm > 0)) throw new Error("masses: direction must be a non-zero vector");
  const direction = opts.direction.map((x) => x / norm);
  const dFrac = kCartToFrac(opts.reciprocal, direction.map((x) => x * h));
  const k0 = Array.from(opts.kFrac);
  const at = (s: number) => {
    const levels = solve(k0.map((x, i) => x + s * (dFrac[i] ?? 0)));
    if (opts.band < 0 || opts.band >= levels.length) throw new Error(`masses: band ${opts.band} does not exist`);
    return levels[opts.band];
  };
  const curvature = (at(1) - 2 * at(0) + at(-1)) / (h * h);
  const flat = Math.abs(curvature) < 1e-9;
  return {
    band: opts.band,
    direction,
    curvature,
    massRatio: flat ? Infinity : HBAR2_OVER_ME / curvature,
    carrier: flat ? "flat" : curvature > 0 ? "electron-like" : "hole-like",
    step: h,
  };
}

/** Masses at a valence maximum and conduction minimum (e.g. from findBandGap) along each direction. */
export function computeEdgeMasses(
  solve: EnergySolver,
  edges: { vbm: { band: number; kFrac: number[] }; cbm: { band: number; kFrac: number[] } },
  directions: number[][],
  reciprocal: number[][],
  step?: number,
): { valence: MassResult[]; conduction: MassResult[] } {
  const along = (edge: { band: number; kFrac: number[] }) =>
    directions.map((direction) => computeEffectiveMass(solve, { band: edge.band, kFrac: edge.kFrac, direction, reciprocal, step }));
  return { valence: along(edges.vbm), conduction: along(edges.cbm) };
}
