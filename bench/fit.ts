/**
 * Fit benchmark: Levenberg–Marquardt refits (fitDocument) of two demo models to synthetic reference bands made from
 * known parameters plus seeded Gaussian noise, each timed against one band evaluation (computeBands, eigenvalues
 * only) at the same reference k-points, measured in the same run. Wall-clock medians; the fit's process CPU time is
 * printed beside it because each LM iteration yields to the event loop once, and that wait is wall time, not work.
 */
import { readFileSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { performance } from "node:perf_hooks";
import { fitBandModel } from "../lib/tb/analysis/fit";
import { fitDocument, seededUniform, type DocumentFitResult } from "../lib/tb/analysis/fit-document";
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

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Median wall ms of one call, timing batches long enough (≥ 20 ms) for the clock. */
function timeSync(run: () => void): number {
  let reps = 1;
  for (let t = 0; t < 20; reps *= 2) {
    const t0 = performance.now();
    for (let r = 0; r < reps; r++) run();
    t = performance.now() - t0;
  }
  const batches = Array.from({ length: 7 }, () => {
    const t0 = performance.now();
    for (let r = 0; r < reps; r++) run();
    return (performance.now() - t0) / reps;
  });
  return median(batches);
}

/**
 * Model evaluations of the same fit, counted by running the engine's plain band fit on the model that fitDocument
 * builds (new document → compile → energies and Hellmann–Feynman derivatives). Checked against fitDocument's result.
 */
async function countEvaluations(doc: ModelDocument, keys: string[], reference: Reference, expected: DocumentFitResult): Promise<number> {
  const derivativeModels = buildDerivativeModels(doc, keys);
  let count = 0;
  const model = {
    evaluate: (p: Float64Array) => {
      count++;
      const next = setParameters(doc, Object.fromEntries(keys.map((k, i) => [k, p[i]])));
      return computeBandDerivatives(compileModel(next), derivativeModels, reference.kFrac);
    },
  };
  const result = await fitBandModel(model, keys, keys.map((k) => getParameter(doc, k)), reference, { occupiedBands: 1 });
  if (result.iterations !== expected.iterations || result.values.some((v, i) => v !== expected.values[i])) {
    throw new Error("fit bench: the counting run differs from fitDocument's run");
  }
  return count;
}

interface Row {
  label: string;
  points: number;
  status: string;
  fitMs: number;
  cpuMs: number;
  iterations: number;
  evaluations: number;
  bandsMs: number;
  worstZ: number;
}

async function benchCase(c: FitCase, pointsTotal: number): Promise<Row> {
  const keys = Object.keys(c.start);
  const reference = syntheticReference(c.truth, pointsTotal);
  const doc = setParameters(c.truth, c.start);
  const fit = () => fitDocument(doc, keys, reference);
  const result = await fit();
  const walls: number[] = [];
  const cpus: number[] = [];
  for (let r = 0; r < c.runs; r++) {
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    await fit();
    walls.push(performance.now() - t0);
    const cpu = process.cpuUsage(cpu0);
    cpus.push((cpu.user + cpu.system) / 1000);
  }
  const compiled = compileModel(doc);
  const bandsMs = timeSync(() => computeBands(compiled, reference.kFrac));
  const se = result.statistics.standardErrors;
  const worstZ = se ? Math.max(...keys.map((k, i) => Math.abs(result.values[i] - getParameter(c.truth, k)) / se[i])) : Infinity;
  return {
    label: c.label, points: reference.kFrac.length, status: result.status, fitMs: median(walls), cpuMs: median(cpus),
    iterations: result.iterations, evaluations: await countEvaluations(doc, keys, reference, result), bandsMs, worstZ,
  };
}

export async function runFitBench(): Promise<void> {
  console.log(`fit: Levenberg–Marquardt refit to synthetic bands (truth + ${NOISE_EV} eV seeded noise), median wall ms; 1 band eval = computeBands at the reference k-points`);
  console.log("model                   k   iter evals   fit ms  cpu ms  band ms  fit/band  iter/band  cpu-iter/band  max|Δp|/σ");
  const rows: Row[] = [];
  for (const c of CASES) {
    for (const points of c.points) {
      const r = await benchCase(c, points);
      rows.push(r);
      console.log(
        `${r.label.padEnd(22)} ${String(r.points).padStart(4)} ${String(r.iterations).padStart(5)} ${String(r.evaluations).padStart(5)} ` +
          `${r.fitMs.toFixed(1).padStart(8)} ${r.cpuMs.toFixed(1).padStart(7)} ${r.bandsMs.toFixed(3).padStart(8)} ` +
          `${(r.fitMs / r.bandsMs).toFixed(0).padStart(9)} ${(r.fitMs / r.iterations / r.bandsMs).toFixed(1).padStart(10)} ` +
          `${(r.cpuMs / r.iterations / r.bandsMs).toFixed(1).padStart(14)} ${r.worstZ.toFixed(2).padStart(10)}  ${r.status}`,
      );
    }
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runFitBench().catch((error: unknown) => {
    console.error(error);
    process.exitCode = 1;
  });
}
