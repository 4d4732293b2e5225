import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument } from "@/lib/tb/document";
import { compileModel } from "@/lib/tb/model";
import { createBandWorkerPool } from "@/lib/tb/parallel-bands";

describe("parallel band runner", () => {
  it("gives the same energies as the single-thread path", async () => {
    const doc = parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-diamond-sp3s.json", "utf8")));
    const model = compileModel(doc);
    const ks = Array.from({ length: 37 }, (_, i) => [Math.sin(i), Math.cos(3 * i) / 2, i / 37]);
    const serial = computeBands(model, ks).energies;
    const pool = createBandWorkerPool(2);
    try {
      await pool.setModel(model);
      const flat = await pool.energies(Float64Array.from(ks.flat()));
      serial.forEach((e, i) => e.forEach((x, j) => expect(flat[i * model.size + j]).toBe(x)));
    } finally {
      await pool.close();
    }
  }, 30_000);
});
