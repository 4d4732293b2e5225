import { execFileSync } from "node:child_process";
import { pathToFileURL } from "node:url";
import { createEigenWorkspace, eigHermitian, eigvalsHermitian } from "../lib/tb/eigen";

/*
 * Hermitian eigen-solver against numpy (LAPACK through OpenBLAS, one thread) on stacks of random
 * Hermitian matrices H = (A + Aᴴ)/2 with standard complex normal A, the same distribution on both sides.
 * Each figure is the best of several repeats after a warm-up, for the whole stack of matrices, in process CPU
 * time on both sides: other jobs on a shared machine then distort the ratio far less than wall-clock time.
 * Goals (colleague's measurement on this machine class): eigenvalues ≤ 0.8× numpy eigvalsh, with vectors
 * ≤ 1.0× numpy eigh, for n ≤ 40.
 */

const SIZES = [8, 10, 20, 40];
const COUNT = 1000;
const REPEATS = 7;
/** Rounds alternate numpy and our solver, so that a burst of load on a shared machine hits both alike. */
const ROUNDS = 3;

type Timing = { values: number; vectors: number };

const NUMPY_SCRIPT = `
import json, sys, time
import numpy as np
count, repeats = int(sys.argv[1]), int(sys.argv[2])
rng = np.random.default_rng(12345)
out = {}
for n in map(int, sys.argv[3:]):
    a = rng.standard_normal((count, n, n)) + 1j * rng.standard_normal((count, n, n))
    h = (a + np.conj(np.swapaxes(a, 1, 2))) / 2
    row = {}
    for key, fn in (("values", np.linalg.eigvalsh), ("vectors", np.linalg.eigh)):
        fn(h)
        best = float("inf")
        for _ in range(repeats):
            t = time.process_time(); fn(h); best = min(best, time.process_time() - t)
        row[key] = best * 1e3
    out[n] = row
print(json.dumps(out))
`;

function timeNumpy(): Record<string, Timing> | string {
  try {
    const stdout = execFileSync(
      "python3",
      ["-c", NUMPY_SCRIPT, String(COUNT), String(REPEATS), ...SIZES.map(String)],
      { encoding: "utf8", env: { ...process.env, OPENBLAS_NUM_THREADS: "1", OMP_NUM_THREADS: "1", MKL_NUM_THREADS: "1" } },
    );
    return JSON.parse(stdout) as Record<string, Timing>;
  } catch (error) {
    return `numpy comparison skipped (python3 with numpy not available: ${(error as Error).message.split("\n")[0]})`;
  }
}

/** Mulberry32 uniform generator with Box–Muller normals: deterministic, dependency-free. */
function normalSource(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

function randomStack(n: number, count: number, seed: number): { re: Float64Array; im: Float64Array } {
  const normal = normalSource(seed);
  const re = new Float64Array(count * n * n);
  const im = new Float64Array(count * n * n);
  for (let m = 0; m < count; m++) {
    const base = m * n * n;
    for (let i = 0; i < n; i++) {
      re[base + i * n + i] = normal();
      for (let j = 0; j < i; j++) {
        const a = normal() / Math.SQRT2;
        const b = normal() / Math.SQRT2;
        re[base + i * n + j] = a;
        im[base + i * n + j] = b;
        re[base + j * n + i] = a;
        im[base + j * n + i] = -b;
      }
    }
  }
  return { re, im };
}

function timeOurs(n: number): Timing {
  const { re, im } = randomStack(n, COUNT, 1000 + n);
  const ws = createEigenWorkspace(n);
  const workRe = new Float64Array(n * n);
  const workIm = new Float64Array(n * n);
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  const size = n * n;
  const runValues = (): void => {
    for (let m = 0; m < COUNT; m++) {
      workRe.set(re.subarray(m * size, (m + 1) * size));
      workIm.set(im.subarray(m * size, (m + 1) * size));
      eigvalsHermitian(n, workRe, workIm, values, ws);
    }
  };
  const runVectors = (): void => {
    for (let m = 0; m < COUNT; m++) {
      workRe.set(re.subarray(m * size, (m + 1) * size));
      workIm.set(im.subarray(m * size, (m + 1) * size));
      eigHermitian(n, workRe, workIm, values, vecRe, vecIm, ws);
    }
  };
  return { values: bestOf(runValues), vectors: bestOf(runVectors) };
}

function bestOf(run: () => void): number {
  run();
  run();
  let best = Infinity;
  for (let r = 0; r < REPEATS; r++) {
    const start = process.cpuUsage();
    run();
    const used = process.cpuUsage(start);
    best = Math.min(best, (used.user + used.system) / 1000);
  }
  return best;
}

const fmt = (x: number, digits = 2): string => x.toFixed(digits).padStart(9);

const bestTiming = (a: Timing | undefined, b: Timing): Timing =>
  a === undefined ? b : { values: Math.min(a.values, b.values), vectors: Math.min(a.vectors, b.vectors) };

export async function runEigenBench(): Promise<void> {
  console.log(
    `Hermitian eigen-solver: ${COUNT} random Hermitian matrices per size, ` +
      `best of ${REPEATS} repeats in each of ${ROUNDS} interleaved rounds (CPU ms)`,
  );
  let notice: string | undefined;
  const numpy = new Map<number, Timing>();
  const ours = new Map<number, Timing>();
  for (let round = 0; round < ROUNDS; round++) {
    const reference = timeNumpy();
    if (typeof reference === "string") notice = reference;
    else for (const n of SIZES) numpy.set(n, bestTiming(numpy.get(n), reference[String(n)]));
    for (const n of SIZES) ours.set(n, bestTiming(ours.get(n), timeOurs(n)));
  }
  if (notice !== undefined) console.log(notice);
  console.log(["n".padStart(5), ...["values", "eigvalsh", "ratio", "vectors", "eigh", "ratio"].map((h) => h.padStart(9))].join(" "));
  for (const n of SIZES) {
    const mine = ours.get(n) as Timing;
    const ref = numpy.get(n);
    const cols = [String(n).padStart(5), fmt(mine.values)];
    if (ref) cols.push(fmt(ref.values), fmt(mine.values / ref.values), fmt(mine.vectors), fmt(ref.vectors), fmt(mine.vectors / ref.vectors));
    else cols.push(fmt(mine.vectors));
    console.log(cols.join(" "));
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runEigenBench().catch((error: unknown) => {
    console.error(error);
    process.exitCode = 1;
  });
}
