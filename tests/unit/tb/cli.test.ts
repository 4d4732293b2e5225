import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const dir = mkdtempSync(join(tmpdir(), "tb-cli-"));
const file = (name: string, content: string) => {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
};
const tb = (...args: string[]) => spawnSync("npx", ["tsx", "lib/tb/cli.ts", ...args], { encoding: "utf8", timeout: 60_000 });
const chain = "db/seed/models/demo-sp-chain.json";

describe("tb command line", () => {
  it("bands: one row per k-point, ascending, matching the analytic s + pz chain", () => {
    // demo-sp-chain: εs = −5, εp = 1.5, ss_sigma = −1.4, pp_sigma = 2.6; at Γ: εs + 2ss, εp + 2pp (Slater & Koster 1954, Table I)
    const k = file("k.json", JSON.stringify({ fractional: [[0], [0.5]] }));
    const r = tb("bands", "--model", chain, "--kpoints", k);
    expect(r.status).toBe(0);
    const { energies } = JSON.parse(r.stdout);
    expect(energies).toHaveLength(2);
    expect(energies[0][0]).toBeCloseTo(-7.8, 12);
    expect(energies[0][1]).toBeCloseTo(6.7, 12);
    expect(energies[1]).toEqual([expect.closeTo(-3.7, 12), expect.closeTo(-2.2, 12)]);
  }, 60_000);

  it("path, hoppings and check run on a demo document", () => {
    const path = JSON.parse(tb("path", "db/seed/models/demo-honeycomb-pz.json", "--points", "31").stdout);
    expect(path.ticks.map((t: { label: string }) => t.label)).toEqual(["Γ", "M", "K", "Γ"]);
    expect(path.energies).toHaveLength(path.distance.length);
    const hop = JSON.parse(tb("hoppings", chain).stdout);
    expect(hop.hoppings.find((h: { from: string; to: string; translation: number[] }) => h.from === "A1:s" && h.to === "A1:pz" && h.translation[0] === 1).re).toBeCloseTo(1.8, 12);
    const check = tb("check", "db/seed/models/demo-diamond-sp3s.json");
    expect(check.status).toBe(0);
    expect(JSON.parse(check.stdout).valid).toBe(true);
  }, 60_000);

  it("exits with 2 and a clear message on bad files", () => {
    const missing = tb("bands", "--model", join(dir, "absent.json"), "--kpoints", join(dir, "absent.json"));
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/cannot read model file .*absent\.json/);
    const notJson = tb("hoppings", file("bad.json", "{ nope"));
    expect(notJson.status).toBe(2);
    expect(notJson.stderr).toMatch(/not valid JSON/);
    const invalid = tb("path", file("invalid.json", JSON.stringify({ format: "bandgate-model", version: 1 })));
    expect(invalid.status).toBe(2);
    expect(invalid.stderr).toMatch(/not a valid model document[\s\S]*lattice/);
    const wrongK = tb("bands", "--model", chain, "--kpoints", file("k3.json", JSON.stringify({ fractional: [[0, 0, 0]] })));
    expect(wrongK.status).toBe(2);
    expect(wrongK.stderr).toMatch(/must hold 1 finite numbers/);
    const check = tb("check", file("invalid2.json", JSON.stringify({ format: "other" })));
    expect(check.status).toBe(2);
  }, 60_000);
});
