import { choleskyFactor, choleskySolve, normalEquations } from "./dense";

/**
 * Levenberg–Marquardt minimisation of ½‖r(p)‖² (Marquardt, J. SIAM 11, 431 (1963)), with Marquardt's
 * diagonal scaling D = diag(JᵀJ) and Nielsen's damping update μ ← μ·max(⅓, 1 − (2ρ − 1)³), ν = 2 on success,
 * μ ← μ·ν, ν ← 2ν on failure (Nielsen, IMM-REP-1999-05; Madsen, Nielsen & Tingleff, "Methods for non-linear
 * least squares problems" (2004), §3.2). Bounds by projection of each trial point onto the box; the gain ratio
 * uses the projected step. Deterministic. Async only so that an AbortSignal raised elsewhere can be seen between
 * iterations: it yields to the event loop before an iteration when YIELD_EVERY_MS have passed since the last yield
 * (a yield costs about 1 ms in Node, more than a whole iteration of a small model).
 */
export interface LeastSquaresProblem {
  /** Residuals r (length m) and row-major Jacobian J (m×n) at p. */
  evaluate(p: Float64Array): { r: Float64Array; jac: Float64Array };
  lower?: Float64Array;
  upper?: Float64Array;
}

/**
 * The minimiser's whole state after an accepted step (ν is 2 after every accepted step): resuming from it repeats
 * exactly what an uninterrupted run would have done next.
 */
export interface LmState {
  parameters: number[];
  damping: number;
  iteration: number;
  cost: number;
  /** The step's relative cost decrease was below the tolerance: the run converged at this step. */
  settled: boolean;
}

export interface LmProgress {
  iteration: number;
  cost: number;
  elapsedMs: number;
  damping: number;
  state: LmState;
}

export interface LmOptions {
  maxIterations?: number;
  /** Stop when the relative cost decrease of an accepted step is below this. Default 1e-12. */
  costTolerance?: number;
  /** Stop when ‖Δp‖ ≤ stepTolerance·(‖p‖ + stepTolerance). Default 1e-10. */
  stepTolerance?: number;
  /** Stop when the projected gradient ‖g‖∞ is below this. Default 1e-12. */
  gradientTolerance?: number;
  onProgress?: (p: LmProgress) => void;
  signal?: AbortSignal;
  /** Continue from this state (of the same problem) instead of starting at the start point. */
  resume?: LmState;
}

export type LmStatus = "converged" | "not converged" | "cancelled";

export interface LmResult {
  status: LmStatus;
  reason: string;
  parameters: Float64Array;
  cost: number;
  iterations: number;
  r: Float64Array;
  jac: Float64Array;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setTimeout(resolve, 0));
const YIELD_EVERY_MS = 20;

function costOf(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return 0.5 * s;
}

function project(p: Float64Array, lo?: Float64Array, hi?: Float64Array): void {
  for (let i = 0; i < p.length; i++) {
    if (lo && p[i] < lo[i]) p[i] = lo[i];
    if (hi && p[i] > hi[i]) p[i] = hi[i];
  }
}

/** Gradient component that can still move the point (zero when a bound blocks the descent direction). */
function projectedGradientNorm(g: Float64Array, p: Float64Array, lo?: Float64Array, hi?: Float64Array): number {
  let m = 0;
  for (let i = 0; i < g.length; i++) {
    if (lo && p[i] <= lo[i] && g[i] > 0) continue;
    if (hi && p[i] >= hi[i] && g[i] < 0) continue;
    m = Math.max(m, Math.abs(g[i]));
  }
  return m;
}

export async function minimiseLeastSquares(problem: LeastSquaresProblem, start: Float64Array, opts: LmOptions = {}): Promise<LmResult> {
  const t0 = Date.now();
  const n = start.length;
  const maxIterations = opts.maxIterations ?? 200;
  const ftol = opts.costTolerance ?? 1e-12;
  const xtol = opts.stepTolerance ?? 1e-10;
  const gtol = opts.gradientTolerance ?? 1e-12;
  const { lower, upper } = problem;
  const resume = opts.resume;
  let p = Float64Array.from(resume?.parameters ?? start);
  project(p, lower, upper);
  let cur = problem.evaluate(p);
  let cost = costOf(cur.r);
  const m = cur.r.length;
  let mu = resume?.damping ?? -1;
  let nu = 2;
  const done = (status: LmStatus, reason: string, iterations: number): LmResult =>
    ({ status, reason, parameters: p, cost, iterations, r: cur.r, jac: cur.jac });
  if (resume?.settled) return done("converged", "cost change below tolerance", resume.iteration);
  let lastYield = -Infinity;
  for (let iter = (resume?.iteration ?? 0) + 1; iter <= maxIterations; iter++) {
    if (Date.now() - lastYield >= YIELD_EVERY_MS) {
      await yieldToEventLoop();
      lastYield = Date.now();
    }
    if (opts.signal?.aborted) return done("cancelled", "cancelled on request", iter - 1);
    const { jtj, jtr } = normalEquations(m, n, cur.jac, cur.r);
    if (projectedGradientNorm(jtr, p, lower, upper) <= gtol) return done("converged", "gradient below tolerance", iter - 1);
    const scale = Float64Array.from({ length: n }, (_, i) => Math.max(jtj[i * n + i], 1e-30));
    if (mu < 0) mu = 1e-3 * Math.max(...scale);
    let accepted = false;
    while (!accepted) {
      const a = Float64Array.from(jtj);
      for (let i = 0; i < n; i++) a[i * n + i] += mu * scale[i];
      const step = Float64Array.from(jtr, (x) => -x);
      if (!choleskyFactor(n, a)) {
        mu *= nu;
        nu *= 2;
        continue;
      }
      choleskySolve(n, a, step);
      const trial = Float64Array.from(p, (x, i) => x + step[i]);
      project(trial, lower, upper);
      const h = Float64Array.from(trial, (x, i) => x - p[i]);
      const hNorm = Math.hypot(...h);
      if (hNorm <= xtol * (Math.hypot(...p) + xtol)) return done("converged", "step below tolerance", iter);
      let predicted = 0;
      for (let i = 0; i < n; i++) {
        let jh = 0;
        for (let j = 0; j < n; j++) jh += jtj[i * n + j] * h[j];
        predicted -= jtr[i] * h[i] + 0.5 * h[i] * jh;
      }
      const next = problem.evaluate(trial);
      const nextCost = costOf(next.r);
      const rho = predicted > 0 ? (cost - nextCost) / predicted : -1;
      if (rho > 0) {
        const relDecrease = (cost - nextCost) / Math.max(cost, 1e-300);
        p = trial;
        cur = next;
        cost = nextCost;
        mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
        nu = 2;
        accepted = true;
        const settled = relDecrease <= ftol;
        opts.onProgress?.({ iteration: iter, cost, elapsedMs: Date.now() - t0, damping: mu, state: { parameters: Array.from(p), damping: mu, iteration: iter, cost, settled } });
        if (settled) return done("converged", "cost change below tolerance", iter);
      } else {
        mu *= nu;
        nu *= 2;
        if (!Number.isFinite(mu) || mu > 1e300) return done("not converged", "damping grew without bound", iter);
      }
    }
  }
  return done("not converged", `no convergence in ${maxIterations} iterations`, maxIterations);
}
