/**
 * Bands benchmark: build H(k) and diagonalise on 1,000 k-points for models of 8, 10, 20 and 40 orbitals,
 * against numpy's LAPACK (H(k) built in numpy from the same hopping list, stacked eigvalsh / eigh, one thread).
 * Single-thread figures are process CPU time on both sides, so that other jobs on a shared machine distort the
 * ratio far less; the two-worker figure is wall-clock time (its point), against numpy's wall-clock time.
 */
import { execFileSync } from "node:child_process";
import { computeEnergiesFlat } from "../lib/tb/bands";
import { DEFAULT_CONVENTIONS } from "../lib/tb/conventions";
import { parseModelDocument, type ModelDocument } from "../lib/tb/document";
import { createEigenWorkspace, eigHermitian } from "../lib/tb/eigen";
import { fillHamiltonianLower } from "../lib/tb/hamiltonian";
import { compileModel, type CompiledModel } from "../lib/tb/model";
import type { Orbital } from "../lib/tb/orbitals";
import { createBandWorkerPool } from "../lib/tb/parallel-bands";

const SP3: Orbital[] = ["s", "px", "py", "pz"];
const SP3S: Orbital[] = [...SP3, "s*"];
const SP3D5S: Orbital[] = [...SP3, "dxy", "dyz", "dzx", "dx2-y2", "dz2", "s*"];

/** Invented benchmark parameters on the diamond lattice (only the matrix sizes and sparsity matter here). */
function diamond(orbitals: Orbital[], spinOrbit: boolean): ModelDocument {
  const a = 5.43;
  const kinds = new Set(orbitals.map((o) => (o === "s" || o === "s*" ? o : o[0])));
  const params: Record<string, number> = { ss_sigma: -1.9, sp_sigma: 2.4, pp_sigma: 3.0, pp_pi: -0.9 };
  if (kinds.has("s*")) Object.assign(params, { "s*p_sigma": 2.3, "ss*_sigma": 0.1, "s*s*_sigma": 0.2 });
  if (kinds.has("d")) Object.assign(params, { sd_sigma: -2.1, pd_sigma: -1.5, pd_pi: 2.1, dd_sigma: -1.2, dd_pi: 2.2, dd_delta: -1.7, "s*d_sigma": -0.6 });
  const energies: Record<string, number> = { s: -4, px: 1.6, py: 1.6, pz: 1.6, dxy: 9, dyz: 9, dzx: 9, "dx2-y2": 9.5, dz2: 9.5, "s*": 6.5 };
  return parseModelDocument({
    format: "bandgate-model", version: 1, name: `bench ${orbitals.length * (spinOrbit ? 4 : 2)} orbitals`,
    conventions: { ...DEFAULT_CONVENTIONS, spinLayout: spinOrbit ? "up-block-then-down-block" : "none" },
    lattice: { dimension: 3, vectors: [[0, a / 2, a / 2], [a / 2, 0, a / 2], [a / 2, a / 2, 0]] },
    sites: [
      { label: "X1", species: "X", position: [0, 0, 0], orbitals },
      { label: "X2", species: "X", position: [a / 4, a / 4, a / 4], orbitals },
    ],
    onsite: { X: Object.fromEntries(orbitals.map((o) => [o, energies[o]])) },
    shells: [{ species: ["X", "X"], index: 1, distance: (a * Math.sqrt(3)) / 4, params }],
    ...(spinOrbit ? { spinOrbit: { X: 0.044 } } : {}),
    electronCount: 8,
    kPath: { type: "standard", lattice: "fcc" },
    validity: {},
    provenance: { referenceMethod: "benchmark", structureSource: "benchmark", citations: {} },
  });
}

export const BENCH_MODELS: [string, ModelDocument][] = [
  ["sp3 (8)", diamond(SP3, false)],
  ["sp3s* (10)", diamond(SP3S, false)],
  ["sp3d5s* (20)", diamond(SP3D5S, false)],
  ["sp3d5s*+SO (40)", diamond(SP3D5S, true)],
];

function kPoints(count: number): Float64Array {
  let seed = 12345;
  return Float64Array.from({ length: count * 3 }, () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) - 0.5);
}

function best(reps: number, run: () => void): number {
  let min = Infinity;
  for (let r = 0; r < reps; r++) {
    const start = process.cpuUsage();
    run();
    const used = process.cpuUsage(start);
    min = Math.min(min, (used.user + used.system) / 1000);
  }
  return min;
}

function withVectors(model: CompiledModel, k: Float64Array): void {
  const n = model.size;
  const re = new Float64Array(n * n), im = new Float64Array(n * n), values = new Float64Array(n);
  const vr = new Float64Array(n * n), vi = new Float64Array(n * n), ws = createEigenWorkspace(n);
  for (let i = 0; i < k.length / 3; i++) {
    fillHamiltonianLower(model, k, re, im, 3 * i);
    eigHermitian(n, re, im, values, vr, vi, ws);
  }
}

const NUMPY = `
import json, sys, time
import numpy as np
out = []
for case in json.load(sys.stdin):
    n = case["n"]; D = np.array(case["disp"]).reshape(-1, 3); K = np.array(case["k"]).reshape(-1, 3)
    T = np.zeros((len(D), n * n), complex)
    np.add.at(T, (np.array(case["di"]), np.array(case["idx"])), np.array(case["re"]) + 1j * np.array(case["im"]))
    H0 = np.diag(case["onsite"]).astype(complex)
    def build():
        return (np.exp(2j * np.pi * (K @ D.T)) @ T).reshape(-1, n, n) + H0
    def best(f, clock):
        m = 1e9
        for _ in range(5):
            t = clock(); f(); m = min(m, clock() - t)
        return m * 1e3
    values = lambda: np.linalg.eigvalsh(build())
    out.append({"eigvalsh": best(values, time.process_time), "eigvalshWall": best(values, time.perf_counter),
                "eigh": best(lambda: np.linalg.eigh(build()), time.process_time), "check": values()[0].tolist()})
print(json.dumps(out))
`;

function numpyTimes(models: CompiledModel[], k: Float64Array): { eigvalsh: number; eigvalshWall: number; eigh: number; check: number[] }[] | string {
  const cases = models.map((m) => ({
    n: m.size, k: Array.from(k), onsite: Array.from(m.onsite), disp: Array.from(m.displacements),
    di: Array.from(m.termDisplacement), idx: Array.from(m.termIndex), re: Array.from(m.termRe), im: Array.from(m.termIm),
  }));
  try {
    const text = execFileSync("python3", ["-c", NUMPY], { input: JSON.stringify(cases), env: { ...process.env, OPENBLAS_NUM_THREADS: "1", OMP_NUM_THREADS: "1", MKL_NUM_THREADS: "1" }, maxBuffer: 1 << 26 });
    return JSON.parse(text.toString());
  } catch (e) {
    return `numpy comparison skipped: python3 with numpy is not available (${(e as Error).message.split("\n")[0]})`;
  }
}

export async function runBandsBench(): Promise<void> {
  const count = 1000;
  const k = kPoints(count);
  const models = BENCH_MODELS.map(([, doc]) => compileModel(doc));
  const reference = numpyTimes(models, k);
  if (typeof reference === "string") console.log(reference);
  for (const m of models) computeEnergiesFlat(m, k, new Float64Array(count * m.size)); // JIT warm-up
  const pool = createBandWorkerPool(2);
  console.log(`bands: ${count} k-points, H(k) build + diagonalisation, best of several runs, CPU ms (2 workers: wall ms), ratio = JS / numpy`);
  console.log("model             eigvals  ratio | 2 workers  ratio | +vectors  ratio");
  try {
    for (const [i, m] of models.entries()) {
      const out = new Float64Array(count * m.size);
      const single = best(15, () => computeEnergiesFlat(m, k, out));
      await pool.setModel(m);
      for (let r = 0; r < 3; r++) await pool.energies(k.slice());
      let parallel = Infinity;
      for (let r = 0; r < 15; r++) {
        const t = performance.now();
        await pool.energies(k.slice());
        parallel = Math.min(parallel, performance.now() - t);
      }
      const vectors = best(7, () => withVectors(m, k));
      const np = typeof reference === "string" ? null : reference[i];
      if (np && Math.abs(np.check[0] - out[0]) > 1e-8) throw new Error(`numpy and JS disagree on ${BENCH_MODELS[i][0]}`);
      const ratio = (x: number, y?: number) => (y ? (x / y).toFixed(2) + "×" : "  -  ");
      console.log(
        `${BENCH_MODELS[i][0].padEnd(16)} ${single.toFixed(2).padStart(8)} ${ratio(single, np?.eigvalsh).padStart(6)} | ${parallel.toFixed(2).padStart(9)} ${ratio(parallel, np?.eigvalshWall).padStart(6)} | ${vectors.toFixed(2).padStart(8)} ${ratio(vectors, np?.eigh).padStart(6)}` +
          (np ? `   (numpy eigvalsh ${np.eigvalsh.toFixed(2)}, wall ${np.eigvalshWall.toFixed(2)}, eigh ${np.eigh.toFixed(2)})` : ""),
      );
    }
    const m10 = models[1];
    const k300 = k.subarray(0, 900);
    const out = new Float64Array(300 * m10.size);
    console.log(`10-orbital model on 300 k-points, eigenvalues: ${best(30, () => computeEnergiesFlat(m10, k300, out)).toFixed(2)} CPU ms (goal ≤ 4 ms)`);
  } finally {
    await pool.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await runBandsBench();
