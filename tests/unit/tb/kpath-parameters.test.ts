import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { computeBands } from "@/lib/tb/bands";
import { parseModelDocument, type ModelDocument } from "@/lib/tb/document";
import { fillHamiltonian } from "@/lib/tb/hamiltonian";
import { cartToFrac, fracToCart, samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { listParameters, setParameters } from "@/lib/tb/parameters";

const demo = (name: string) => parseModelDocument(JSON.parse(readFileSync(`db/seed/models/${name}.json`, "utf8")));

describe("k-paths (Setyawan and Curtarolo, Comput. Mater. Sci. 49, 299 (2010))", () => {
  it("places the fcc points at their Cartesian positions for a permuted primitive basis", () => {
    // fcc, cubic axes along x, y, z: X = (2π/a)(0, 1, 0) up to symmetry, L = (π/a)(1, 1, 1), W = (2π/a)(1/2, 1, 0)
    const doc = demo("demo-diamond-sp3s");
    const v = doc.lattice.vectors;
    const permuted = { ...doc, lattice: { ...doc.lattice, vectors: [v[2], v[0], v[1]] } };
    const a = 5.5, u = (2 * Math.PI) / a;
    const model = compileModel(permuted);
    const path = samplePath(permuted, 100);
    const at = (label: string) => fracToCart(model, path.kFrac[path.ticks.find((t) => t.label === label)!.index]).map((x) => Math.abs(x) / u);
    expect(at("X").sort((p, q) => p - q)).toEqual([expect.closeTo(0, 10), expect.closeTo(0, 10), expect.closeTo(1, 10)]);
    expect(at("L")).toEqual([expect.closeTo(0.5, 10), expect.closeTo(0.5, 10), expect.closeTo(0.5, 10)]);
    expect(at("W").sort((p, q) => p - q)).toEqual([expect.closeTo(0, 10), expect.closeTo(0.5, 10), expect.closeTo(1, 10)]);
  });

  it("finds K of the honeycomb where the pz bands touch (Wallace, Phys. Rev. 71, 622 (1947))", () => {
    const doc = demo("demo-honeycomb-pz");
    const path = samplePath(doc, 61);
    const k = path.kFrac[path.ticks.find((t) => t.label === "K")!.index];
    const [e] = computeBands(compileModel(doc), [k]).energies;
    expect(Math.abs(e[0]) + Math.abs(e[1])).toBeLessThan(1e-10);
  });

  it("samples about the requested number of points with non-decreasing distance, and converts both ways", () => {
    const doc = demo("demo-diamond-sp3s");
    const path = samplePath(doc, 240);
    expect(path.kFrac).toHaveLength(240);
    path.distance.slice(1).forEach((d, i) => expect(d).toBeGreaterThanOrEqual(path.distance[i] - 1e-12));
    const model = compileModel(doc);
    const f = [0.3, -0.2, 0.45];
    expect(cartToFrac(model, fracToCart(model, f))).toEqual(f.map((x) => expect.closeTo(x, 12)));
  });
});

describe("parameters", () => {
  it("lists stable keys and sets values into a new document", () => {
    const doc = demo("demo-diamond-sp3s");
    const keys = listParameters(doc).map((p) => p.key);
    expect(keys).toContain("onsite/X/s*");
    expect(keys).toContain("shell/X-X/1/pp_pi");
    const next = setParameters(doc, { "shell/X-X/1/pp_pi": -1.1 });
    expect(next.shells[0].params.pp_pi).toBe(-1.1);
    expect(doc.shells[0].params.pp_pi).toBe(-0.9);
    expect(() => setParameters(doc, { "shell/X-X/2/pp_pi": 1 })).toThrow(/unknown parameter/);
  });

  it("H(k) is linear in every listed parameter: H(p) = H(0) + p·(H(1) − H(0))", () => {
    const base = demo("demo-diamond-sp3s");
    const doc: ModelDocument = { ...base, hoppings: [{ from: { site: "X1", orbital: "s" as const }, to: { site: "X2", orbital: "pz" as const }, translation: [1, 0, 0], value: { re: 0.2, im: 0.1 } }] };
    const k = [0.11, 0.23, -0.31];
    const h = (d: ModelDocument) => {
      const m = compileModel(d);
      const re = new Float64Array(m.size ** 2), im = new Float64Array(m.size ** 2);
      fillHamiltonian(m, k, re, im);
      return [re, im];
    };
    for (const p of listParameters(doc)) {
      const [r0, i0] = h(setParameters(doc, { [p.key]: 0 }));
      const [r1, i1] = h(setParameters(doc, { [p.key]: 1 }));
      const [rp, ip] = h(doc);
      rp.forEach((x, j) => expect(x, p.key).toBeCloseTo(r0[j] + p.value * (r1[j] - r0[j]), 12));
      ip.forEach((x, j) => expect(x, p.key).toBeCloseTo(i0[j] + p.value * (i1[j] - i0[j]), 12));
    }
  });
});
