import { readFileSync } from "node:fs";
import { afterAll, describe, expect, it } from "vitest";
import { deriveRevisionFacts } from "@/board/revision-facts";
import { closeEnginePool, enginePool, runEngine } from "@/lib/engine-pool/engine";
import { parseModelDocument } from "@/lib/tb/document";
import { setParameters } from "@/lib/tb/parameters";

afterAll(closeEnginePool);

const chain = parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-sp-chain.json", "utf8")));

// The first task starts a thread that loads the engine's TypeScript source (tsx): seconds on a busy machine.
describe("engine computations on the pool's threads", { timeout: 60_000 }, () => {
  it("gives exactly what the engine gives on the caller's thread", async () => {
    const changed = setParameters(chain, { "shell/A-A/1/ss_sigma": -1.5 });
    expect(await runEngine("revisionFacts", changed, chain, [])).toEqual(deriveRevisionFacts(changed, chain, []));
    expect(enginePool().stats.threads).toBeGreaterThan(0);
  });

  it("returns expected refusals as values (a document over the basis limit, a reference file with problems)", async () => {
    const report = await runEngine("validateDocument", chain, 1);
    expect(report.document).toBeNull();
    expect(report.oversize).toEqual({ basis: 2, limit: 1 });
    expect(report.errors[0].message).toBe("The model's basis has 2 states (2 orbitals per cell); this Bandgate accepts models of at most 1 states.");
    const checked = await runEngine("referenceBands", "bad.csv", "k_index,E1 (eV)\n0,abc\n", chain, 101);
    expect(checked.ok).toBe(false);
    expect(checked.ok ? [] : checked.issues.map((i) => i.message).join(" ")).toMatch(/line 2, column 2/);
  });
});
