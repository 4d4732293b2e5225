/**
 * Fit benchmark: Levenberg–Marquardt refits (fitDocument) of two demo models to synthetic reference bands made from
 * known parameters plus seeded Gaussian noise, each timed against one band evaluation (computeBands, eigenvalues
 * only) at the same reference k-points, measured in the same run. Wall-clock medians. No database: the job queue
 * around a fit is exercised by the integration tests; this measures the engine.
 */
import { readFileSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { performance } from "node:perf_hooks";
import { fitBandModel } from "../lib/tb/analysis/fit";
import { fitDocument, type DocumentFitResult } from "../lib/tb/analysis/fit-document";
import { seededUniform } from "../lib/tb/analysis/seeded-uniform";
import { buildDerivativeModels, computeBandDerivatives } from "../lib/tb/analysis/sensitivity";
import { computeBands } from "../lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "../lib/tb/document";
import { samplePath } from "../lib/tb/kpath";
import { compileModel } from "../lib/tb/model";
import { getParameter, setParameters } from "../lib/tb/parameters";

type Reference = { kFrac: number[][]; energies: number[][] };

interface FitCase {
  label: string;
  truth: ModelDocument;
  /** Start values of the free parameters (the truth moved by 5–20 %). */
  start: Record<string, number>;
  points: number[];
  runs: number;
}

const NOISE_EV = 0.005;
const NOISE_SEED = 2024;

function readSeedModel(name: string): ModelDocument {
  return parseModelDocument(JSON.parse(readFileSync(new URL(`../db/seed/models/${name}.json`, import.meta.url), "utf8")));
}

const CASES: FitCase[] = [
  {
    label: "s+pz chain, 5 free",
    truth: readSeedModel("demo-sp-chain"),
    start: { "onsite/A/s": -4.6, "onsite/A/pz": 1.8, "shell/A-A/1/ss_sigma": -1.2, "shell/A-A/1/sp_sigma": 1.5, "shell/A-A/1/pp_sigma": 2.9 },
    points: [100, 400],
    runs: 7,
  },
  {
    label: "diamond sp3s*, 7 free",
    truth: readSeedModel("demo-diamond-sp3s"),
    start: {
      "onsite/X/s": -3.6, "onsite/X/s*": 6.9, "shell/X-X/1/ss_sigma": -1.7, "shell/X-X/1/sp_sigma": 2.6,
      "shell/X-X/1/pp_sigma": 2.8, "shell/X-X/1/pp_pi": -1.0, "shell/X-X/1/s*p_sigma": 2.1,
    },
    points: [200, 800],
    runs: 3,
  },
];

/** Bands of the truth on its default path plus Gaussian noise (Box & Muller, Ann. Math. Stat. 29, 610 (1958)). */
function syntheticReference(truth: ModelDocument, pointsTotal: number): Reference {
  const kFrac = samplePath(truth, pointsTotal).kFrac;
  const uniform = seededUniform(NOISE_SEED);
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  const energies = computeBands(compileModel(truth), kFrac).energies.map((row) => Array.from(row, (e) => e + NOISE_EV * normal()));
  return { kFrac, energies };
}

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** A timer of `run` in batches long enough (≈ 20 ms) for the clock: each call times one batch, in ms per run. */
function batchTimer(run: () => void): () => number {
  run();
  const t0 = performance.now();
  run();
  const reps = Math.max(1, Math.ceil(20 / (performance.now() - t0)));
  return () => {
    const start = performance.now();
    for (let r = 0; r < reps; r++) run();
    return (performance.now() - start) / reps;
  };
}

/** ms per wait for a 0 ms timeout, the yield LM takes between iterations at most every 20 ms (mean of 10 waits). */
async function timeYield(): Promise<number> {
  const t0 = performance.now();
  for (let i = 0; i < 10; i++) await new Promise<void>((resolve) => setTimeout(resolve, 0));
  return (performance.now() - t0) / 10;
}

/**
 * The model that fitDocument builds (new document → compile → energies and Hellmann–Feynman derivatives at the
 * reference k-points), rebuilt here with a counter so that the evaluations of a fit can be counted and one timed.
 */
function countingModel(doc: ModelDocument, keys: string[], kFrac: number[][]) {
  const derivativeModels = buildDerivativeModels(doc, keys);
  const model = {
    count: 0,
    evaluate(p: ArrayLike<number>) {
      model.count++;
      const next = setParameters(doc, Object.fromEntries(keys.map((k, i) => [k, p[i]])));
      return computeBandDerivatives(compileModel(next), derivativeModels, kFrac);
    },
  };
  return model;
}

/** Evaluations of the same fit, counted on the engine's plain band fit; checked against fitDocument's result. */
async function countEvaluations(doc: ModelDocument, keys: string[], reference: Reference, expected: DocumentFitResult): Promise<number> {
  const model = countingModel(doc, keys, reference.kFrac);
  const result = await fitBandModel(model, keys, keys.map((k) => getParameter(doc, k)), reference);
  if (result.iterations !== expected.iterations || result.values.some((v, i) => v !== expected.values[i])) {
    throw new Error("fit bench: the counting run differs from fitDocument's run");
  }
  return model.count;
}

interface Row {
  label: string;
  points: number;
  status: string;
  iterations: number;
  evaluations: number;
  fitMs: number;
  yieldMs: number;
  bandsMs: number;
  evaluationMs: number;
  worstZ: number;
}

async function benchCase(c: FitCase, pointsTotal: number): Promise<Row> {
  const keys = Object.keys(c.start);
  const reference = syntheticReference(c.truth, pointsTotal);
  const doc = setParameters(c.truth, c.start);
  const fit = () => fitDocument(doc, keys, reference);
  const result = await fit();
  await fit();
  const compiled = compileModel(doc);
  const timeBands = batchTimer(() => computeBands(compiled, reference.kFrac));
  const model = countingModel(doc, keys, reference.kFrac);
  const timeEvaluation = batchTimer(() => model.evaluate(result.start));
  // Fits and reference batches alternate, so that a burst of load on a shared machine hits both alike.
  const walls: number[] = [];
  const yields: number[] = [];
  const bands: number[] = [];
  const evaluations: number[] = [];
  for (let r = 0; r < c.runs; r++) {
    const t0 = performance.now();
    await fit();
    walls.push(performance.now() - t0);
    yields.push(await timeYield());
    bands.push(timeBands(), timeBands());
    evaluations.push(timeEvaluation());
  }
  const se = result.statistics.standardErrors;
  const worstZ = se ? Math.max(...keys.map((k, i) => Math.abs(result.values[i] - getParameter(c.truth, k)) / se[i])) : Infinity;
  return {
    label: c.label, points: reference.kFrac.length, status: result.status, iterations: result.iterations,
    evaluations: await countEvaluations(doc, keys, reference, result), fitMs: median(walls), yieldMs: median(yields),
    bandsMs: median(bands), evaluationMs: median(evaluations), worstZ,
  };
}

const perIteration = (r: Row): number => r.fitMs / r.iterations / r.bandsMs;

/**
 * Goals, in band evaluations per LM iteration (wall time: what a modeller waits for). One fit evaluation = compile
 * the new document + eigenvectors + P Hellmann–Feynman passes (one ∂H fill and n expectation values per k-point):
 * the "eval/band" column, measured ≈ 6–10 for both (chain P = 5, where compiling costs as much as its 2×2 solves;
 * sp3s* P = 7). Common practice: LM with an exact Jacobian costs about one such evaluation per iteration; here
 * about 1.0–1.3, as each rejected step costs one more (start and end points are each evaluated once). Expected for
 * sp3s*: ≈ 1.3 × 8 ≈ 10 plus the set-up spread over the iterations; measured 10–16, up to 20 with other jobs on
 * the machine's two cores, hence ≤ 25. LM yields to the event loop at most every 20 ms (Node runs a 0 ms timeout
 * after ≥ 1 ms, Node.js docs, setTimeout), so a whole chain fit waits about once, 10–25 of its 0.05–0.1 ms band
 * evaluations ("yld/band", per fit rather than per iteration since the yield was rationed): expected ≈ 1.3 × 7 + a
 * few ≈ 15, before rationing 23–43, hence ≤ 50. The yield is a fixed time, so on a faster machine this ratio
 * grows: if it fails there, look at the yld/band column before looking for a slower engine.
 * A fast fit that misses the truth is worthless: every fit must converge in ≤ 20 iterations (Gauss–Newton-like
 * steps on a nearly zero-residual problem from a 5–20 % start) to within 4 standard errors of every true parameter.
 */
const GOALS: { label: string; limit: number }[] = [
  { label: "s+pz chain, 5 free", limit: 50 },
  { label: "diamond sp3s*, 7 free", limit: 25 },
];

function printGoals(rows: Row[]): void {
  const met = (ok: boolean) => (ok ? "met" : "NOT MET");
  for (const goal of GOALS) {
    const worst = Math.max(...rows.filter((r) => r.label === goal.label).map(perIteration));
    console.log(`goal: ${goal.label}: ≤ ${goal.limit} band evaluations per iteration (worst ${worst.toFixed(1)}): ${met(worst <= goal.limit)}`);
  }
  const converged = rows.every((r) => r.status === "converged" && r.iterations <= 20 && r.worstZ <= 4);
  console.log(`goal: every fit converged in ≤ 20 iterations with max |Δp|/σ ≤ 4: ${met(converged)}`);
}

const cell = (x: number, width: number, digits: number): string => x.toFixed(digits).padStart(width);

export async function runFitBench(): Promise<void> {
  console.log(`fit: Levenberg–Marquardt refit to synthetic bands (truth + ${NOISE_EV} eV seeded noise), median wall ms;`);
  console.log("band = one band evaluation (eigenvalues) at the reference k-points; eval = one fit evaluation (bands, vectors, derivatives);");
  console.log("yld = one event-loop yield (at most one per 20 ms of fitting); max|Δp|/σ = worst |fitted − true| over its standard error");
  console.log("model                     k  iter evals   fit ms ms/iter  band ms fit/band iter/band yld/band eval/band max|Δp|/σ");
  const rows: Row[] = [];
  for (const c of CASES) {
    for (const points of c.points) {
      const r = await benchCase(c, points);
      rows.push(r);
      console.log(
        `${r.label.padEnd(22)} ${String(r.points).padStart(4)} ${String(r.iterations).padStart(5)} ${String(r.evaluations).padStart(5)} ` +
          `${cell(r.fitMs, 8, 1)} ${cell(r.fitMs / r.iterations, 7, 2)} ${cell(r.bandsMs, 8, 3)} ${cell(r.fitMs / r.bandsMs, 8, 0)} ${cell(perIteration(r), 9, 1)} ` +
          `${cell(r.yieldMs / r.bandsMs, 9, 1)} ${cell(r.evaluationMs / r.bandsMs, 9, 1)} ${cell(r.worstZ, 9, 2)}  ${r.status}`,
      );
    }
  }
  printGoals(rows);
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runFitBench().catch((error: unknown) => {
    console.error(error);
    process.exitCode = 1;
  });
}
