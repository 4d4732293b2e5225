import type { EnergySolver } from "./constants";
import type { CheckResult } from "./check-result";
import type { KMesh } from "./mesh";

/** max |H_ij − conj(H_ji)| over the given matrices (row-major re/im pairs). */
export function checkHermiticity(n: number, matrices: { re: Float64Array; im: Float64Array }[], tol = 1e-10): CheckResult {
  let worst = 0;
  for (const { re, im } of matrices) {
    for (let i = 0; i < n; i++) {
      for (let j = i; j < n; j++) {
        const d = Math.hypot(re[i * n + j] - re[j * n + i], im[i * n + j] + im[j * n + i]);
        worst = Math.max(worst, d);
      }
    }
  }
  return {
    id: "hermiticity",
    title: "H(k) is Hermitian",
    status: worst <= tol ? "pass" : "fail",
    detail: `largest |H_ij − H_ji*| at ${matrices.length} k-points: ${worst.toExponential(2)} eV (tolerance ${tol} eV)`,
    measured: worst,
  };
}

/**
 * Time reversal: E_n(k) = E_n(−k) (Kramers; e.g. Ashcroft & Mermin, Solid State Physics (1976), ch. 8) for a
 * Hamiltonian without magnetic terms. With declared magnetic terms (complex hoppings) a violation is a warning.
 */
export function checkTimeReversal(solve: EnergySolver, kFrac: number[][], magnetic: boolean, tol = 1e-8): CheckResult {
  let worst = 0;
  for (const k of kFrac) {
    const a = solve(k);
    const b = solve(k.map((x) => -x));
    for (let n = 0; n < a.length; n++) worst = Math.max(worst, Math.abs(a[n] - b[n]));
  }
  const ok = worst <= tol;
  return {
    id: "time-reversal",
    title: "E(k) = E(−k)",
    status: ok ? "pass" : magnetic ? "warn" : "fail",
    detail: `largest |E_n(k) − E_n(−k)| at ${kFrac.length} k-points: ${worst.toExponential(2)} eV` +
      (!ok && magnetic ? "; the document has complex hoppings, which may break time reversal" : ""),
    measured: worst,
  };
}

/**
 * Trace sum rule: the Brillouin-zone average of Σ_n E_n(k) = Tr H averaged = Σ on-site energies, since every
 * hopping term carries a phase e^{ik·d} that averages to zero (exact on a mesh finer than the longest hopping).
 */
export function checkTraceSumRule(solve: EnergySolver, mesh: KMesh, onsiteSum: number, tol = 1e-8): CheckResult {
  let avg = 0;
  mesh.kFrac.forEach((k, i) => {
    const levels = solve(k);
    let s = 0;
    for (let n = 0; n < levels.length; n++) s += levels[n];
    avg += mesh.weights[i] * s;
  });
  const diff = Math.abs(avg - onsiteSum);
  return {
    id: "trace-sum-rule",
    title: "Zone average of Σ E_n equals Σ on-site energies",
    status: diff <= tol * Math.max(1, Math.abs(onsiteSum)) ? "pass" : "fail",
    detail: `average Σ E_n = ${avg.toFixed(9)} eV, Σ on-site = ${onsiteSum.toFixed(9)} eV over ${mesh.kFrac.length} k-points`,
    measured: diff,
  };
}

export interface DeclaredDegeneracy {
  /** A label of the default path (e.g. "Γ") or fractional coordinates. */
  point: string | number[];
  /** Band indices (0-based, ascending order of energy) that must coincide. */
  bands: number[];
  tolerance?: number;
}

export function checkDegeneracies(solve: EnergySolver, declared: DeclaredDegeneracy[], pointOf: (label: string) => number[] | undefined): CheckResult {
  const problems: string[] = [];
  let worst = 0;
  for (const d of declared) {
    const k = typeof d.point === "string" ? pointOf(d.point) : d.point;
    const name = typeof d.point === "string" ? d.point : `(${d.point.join(", ")})`;
    if (!k) {
      problems.push(`${name}: no such point on the default path`);
      continue;
    }
    const levels = solve(k);
    if (d.bands.some((b) => b < 0 || b >= levels.length)) {
      problems.push(`${name}: band index outside 0…${levels.length - 1}`);
      continue;
    }
    const values = d.bands.map((b) => levels[b]);
    const spread = Math.max(...values) - Math.min(...values);
    worst = Math.max(worst, spread);
    if (spread > (d.tolerance ?? 1e-6)) problems.push(`${name}: bands ${d.bands.join(", ")} spread over ${spread.toExponential(2)} eV`);
  }
  return {
    id: "declared-degeneracies",
    title: "Declared degeneracies at high-symmetry points",
    status: problems.length === 0 ? "pass" : "fail",
    detail: declared.length === 0 ? "none declared" : problems.length === 0 ? `${declared.length} declared, all hold` : problems.join("; "),
    measured: declared.length === 0 ? null : worst,
  };
}
