import { invertSpd, normalEquations } from "./dense";

/**
 * Parameter covariance σ²(JᵀJ)⁻¹ with σ² = Σr²/(m − n) (the residual variance), standard errors and
 * correlations (e.g. Press et al., Numerical Recipes, 2nd ed. (1992), §15.5–15.6). null when JᵀJ is singular:
 * some parameter combination is not determined by the reference.
 */
export interface FitStatistics {
  residualVariance: number;
  covariance: number[][] | null;
  standardErrors: number[] | null;
  correlations: number[][] | null;
}

export function computeFitStatistics(r: Float64Array, jac: Float64Array, n: number): FitStatistics {
  const m = r.length;
  let ss = 0;
  for (let i = 0; i < m; i++) ss += r[i] * r[i];
  const residualVariance = m > n ? ss / (m - n) : NaN;
  const { jtj } = normalEquations(m, n, jac, r);
  const inv = invertSpd(n, jtj);
  if (!inv || !Number.isFinite(residualVariance)) return { residualVariance, covariance: null, standardErrors: null, correlations: null };
  const covariance = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => residualVariance * inv[i * n + j]));
  const standardErrors = covariance.map((row, i) => Math.sqrt(row[i]));
  const correlations = covariance.map((row, i) => row.map((c, j) => c / (standardErrors[i] * standardErrors[j] || 1)));
  return { residualVariance, covariance, standardErrors, correlations };
}
