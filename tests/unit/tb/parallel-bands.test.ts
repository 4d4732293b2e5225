import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument } from "@/lib/tb/document";
import { compileModel, type CompiledModel } from "@/lib/tb/model";
import { createBandWorkerPool, type BandWorkerPool } from "@/lib/tb/parallel-bands";

const demo = (name: string) => compileModel(parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8"))));

/** The single-thread path, flattened k-major: the parallel runner must reproduce it bit for bit. */
function serialFlat(model: CompiledModel, kFlat: Float64Array): Float64Array {
  const d = model.dimension;
  const ks = Array.from({ length: kFlat.length / d }, (_, i) => Array.from(kFlat.subarray(i * d, i * d + d)));
  const out = new Float64Array(ks.length * model.size);
  computeBands(model, ks).energies.forEach((e, i) => out.set(e, i * model.size));
  return out;
}

const kList = (count: number, d: number, seed: number) =>
  Float64Array.from({ length: count * d }, (_, i) => Math.sin(seed * 7.1 + i * 1.37) / 2);

describe("parallel band runner", () => {
  let pool: BandWorkerPool;
  beforeAll(() => {
    pool = createBandWorkerPool(2);
  });
  afterAll(async () => {
    await pool.close();
  });

  it("gives the same energies as the single-thread path", async () => {
    const model = demo("demo-diamond-sp3s");
    const ks = Array.from({ length: 37 }, (_, i) => [Math.sin(i), Math.cos(3 * i) / 2, i / 37]);
    const serial = computeBands(model, ks).energies;
    await pool.setModel(model);
    const flat = await pool.energies(Float64Array.from(ks.flat()));
    serial.forEach((e, i) => e.forEach((x, j) => expect(flat[i * model.size + j]).toBe(x)));
  }, 30_000);

  it("covers every k-point once for counts that do not split evenly into chunks", async () => {
    const model = demo("demo-honeycomb-pz");
    await pool.setModel(model);
    for (const count of [1, 2, 3, 17, 1001]) {
      const k = kList(count, model.dimension, count);
      expect(await pool.energies(k)).toEqual(serialFlat(model, k));
    }
  }, 30_000);

  it("keeps concurrent batches and model changes apart", async () => {
    const chain = demo("demo-sp-chain"), diamond = demo("demo-diamond-sp3s");
    const kChain = kList(301, 1, 1), kDiamond = kList(101, 3, 2), kSmall = kList(5, 1, 3);
    await pool.setModel(chain);
    const first = pool.energies(kChain);
    const second = pool.energies(kSmall);
    const switched = pool.setModel(diamond).then(() => pool.energies(kDiamond));
    expect(await first).toEqual(serialFlat(chain, kChain));
    expect(await second).toEqual(serialFlat(chain, kSmall));
    expect(await switched).toEqual(serialFlat(diamond, kDiamond));
  }, 30_000);

  it("returns nothing for no k-points and rejects a partial k-point", async () => {
    const model = demo("demo-diamond-sp3s");
    await pool.setModel(model);
    expect((await pool.energies(new Float64Array(0))).length).toBe(0);
    await expect(pool.energies(new Float64Array(4))).rejects.toThrow(/whole number/);
    expect(await pool.energies(kList(3, 3, 9))).toEqual(serialFlat(model, kList(3, 3, 9)));
  }, 30_000);

  it("reports a worker-side failure instead of hanging", async () => {
    const model = demo("demo-sp-chain");
    await pool.setModel({ ...model, onsite: new Float64Array(0), size: -1 });
    await expect(pool.energies(kList(4, 1, 4))).rejects.toThrow();
    await pool.setModel(model);
    expect(await pool.energies(kList(4, 1, 4))).toEqual(serialFlat(model, kList(4, 1, 4)));
  }, 30_000);
});
