import { desc, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { uploadReferenceBands } from "@/board/reference-upload";
import { saveRevision } from "@/board/service";
import { closeDb, db } from "@/db/client";
import { referenceBandSets, revisions } from "@/db/schema";
import type { FitOutcome } from "@/lib/fits/record";
import type { FitRunView } from "@/lib/fits/view";
import { samplePath } from "@/lib/tb/kpath";
import { parseModelDocument } from "@/lib/tb/document";
import { getParameter, setParameters } from "@/lib/tb/parameters";
import { chainDocument, versionOf } from "../support/board-fixtures";
import type { HttpSession } from "../support/http-session";
import { createPerson } from "../support/people";
import {
  CHAIN_KEYS,
  CHAIN_START,
  createFitWorld,
  DIAMOND_KEYS,
  DIAMOND_START,
  diamondDocument,
  finishedFit,
  fitRow,
  fitRunCount,
  proposalToFit,
  revisionCount,
  revisionDocument,
  signedIn,
  startFitOverHttp,
  syntheticReference,
} from "./fit-world";
import { waitFor } from "./registry-world";

afterAll(closeDb);

const SIGMA = 0.002;
const truth = chainDocument();
const PROVENANCE = { method: "synthetic", code: "test fixture", structureSource: "the model's own lattice" };
const chainSpec = (referenceSetId: string, extra: Record<string, unknown> = {}) => ({ referenceSetId, parameters: CHAIN_KEYS.map((key) => ({ key })), ...extra });

/** A proposal of the demo sp3s* model whose reference has `points` k-points (fit time grows with it). */
async function diamondProposal(points: number) {
  const diamond = diamondDocument();
  const world = await createFitWorld(diamond);
  const { proposalId, referenceId } = await proposalToFit(world, diamond, DIAMOND_START, syntheticReference(diamond, 0.003, 3, points), points);
  return { proposalId, author: await signedIn(world.author), spec: { referenceSetId: referenceId, parameters: DIAMOND_KEYS.map((key) => ({ key })) } };
}

async function chainProposal(seed = 11) {
  const world = await createFitWorld(truth);
  const reference = syntheticReference(truth, SIGMA, seed);
  const { proposalId, referenceId } = await proposalToFit(world, truth, CHAIN_START, reference);
  return { world, proposalId, referenceId, reference, author: await signedIn(world.author) };
}

/**
 * Bands of the s + pz chain along its axis from the two-centre table (Slater & Koster, Phys. Rev. 94, 1498 (1954),
 * Table I: E_s,s = V_ssσ, E_s,z = n·V_spσ, E_z,z = n²·V_ppσ + (1 − n²)·V_ppπ, with n = ±1 for the neighbours at ±a ẑ):
 * H_ss = ε_s + 2V_ssσ cos ka, H_zz = ε_p + 2V_ppσ cos ka, |H_sz| = 2|V_spσ| sin ka.
 */
function analyticChainBands(v: Record<string, number>, kFrac: number): [number, number] {
  const c = Math.cos(2 * Math.PI * kFrac);
  const hs = v["onsite/A/s"] + 2 * v["shell/A-A/1/ss_sigma"] * c;
  const hp = v["onsite/A/pz"] + 2 * v["shell/A-A/1/pp_sigma"] * c;
  const r = Math.hypot((hs - hp) / 2, 2 * v["shell/A-A/1/sp_sigma"] * Math.sin(2 * Math.PI * kFrac));
  return [(hs + hp) / 2 - r, (hs + hp) / 2 + r];
}

describe("refit of the s + pz chain over HTTP", () => {
  let first: { fitId: string; proposalId: string; outcome: FitOutcome; author: HttpSession } | undefined;

  it("recovers the five parameters behind synthetic bands within 3 standard errors and saves them as the next revision", async () => {
    const { world, proposalId, referenceId, reference, author } = await chainProposal();
    const fitId = await startFitOverHttp(author, proposalId, chainSpec(referenceId));
    const row = await finishedFit(fitId);
    const { fit, outcome } = (await (await author.fetch(`/api/fits/${fitId}`)).json()) as { fit: FitRunView; outcome: FitOutcome };
    expect(fit.status, fit.failureReason ?? "").toBe("converged");
    expect(outcome.names).toEqual(CHAIN_KEYS);
    /*
     * Identifiability (analytic): H(k) above is 2×2 with trace T = (ε_s + ε_p) + 2(V_ss + V_pp)·c and determinant
     * D = (ε_s·ε_p − 4V_sp²) + 2(ε_s·V_pp + ε_p·V_ss)·c + 4(V_ss·V_pp + V_sp²)·c², c = cos ka. The two bands give T and D
     * at every k, so these five coefficients are fixed, and their Jacobian with respect to (ε_s, ε_p, V_ss, V_pp, V_sp)
     * has determinant 2V_sp·[4(V_pp − V_ss)² − (ε_p − ε_s)²], at the truth 2·1.8·(4·4.0² − 6.5²) = 78.3 ≠ 0, so the
     * parameters are determined up to the sign of V_sp and the s↔p relabelling, both far from the start. So the fit must
     * find the truth, to within the noise.
     * 3σ: with a correct covariance σ²(JᵀJ)⁻¹ (Press et al., Numerical Recipes, 2nd ed. (1992), §15.6) each estimate lies
     * within 3 standard errors with probability 99.7 % (Gaussian errors; 3σ as the limit is common practice). The seed is
     * fixed, so the test is deterministic, yet a biased fit or standard errors too small by a factor of ~3 would fail it.
     */
    const se = outcome.standardErrors as number[];
    CHAIN_KEYS.forEach((key, i) => {
      expect(se[i]).toBeGreaterThan(0);
      expect(se[i]).toBeLessThan(0.01);
      expect(Math.abs(outcome.values[i] - getParameter(truth, key)), key).toBeLessThan(3 * se[i]);
    });
    // rms² ≈ σ²(N − p)/N for N = 202 points, p = 5; its relative spread is √(2/(N − p)) ≈ 10 % (χ² statistics, Press et al. §15.1), so ±15 % on rms is ~3σ.
    expect(outcome.rms / SIGMA).toBeGreaterThan(0.85);
    expect(outcome.rms / SIGMA).toBeLessThan(1.15);
    // The fitted values through the analytic bands (not the engine) sit on the reference within the same noise.
    const values = Object.fromEntries(CHAIN_KEYS.map((k, i) => [k, outcome.values[i]]));
    const kFrac = samplePath(truth).kFrac;
    const energies = (JSON.parse(reference) as { energies: number[][] }).energies;
    const sq = energies.flatMap((row, k) => analyticChainBands(values, kFrac[k][0]).map((e, b) => (e - row[b]) ** 2));
    expect(Math.sqrt(sq.reduce((a, b) => a + b) / sq.length) / SIGMA).toBeLessThan(1.15);

    expect(fit.resultRevision).toBe(fit.baseRevision + 1);
    const saved = await revisionDocument(row.resultRevisionId as string);
    CHAIN_KEYS.forEach((key, i) => expect(getParameter(saved.doc, key)).toBe(outcome.values[i]));
    expect(saved.row.note).toContain(`fit ${fitId.slice(0, 8)}`);
    expect(saved.row.note).toMatch(/^Refit of 5 parameters to "synthetic bands": RMS \d\.\d meV, .*converged in \d+ iterations/);
    expect(saved.row.createdBy).toBe(world.author.id);
    const listed = (await (await author.fetch(`/api/proposals/${proposalId}/fits`)).json()) as { fits: FitRunView[] };
    expect(listed.fits.map((f) => [f.id, f.status])).toEqual([[fitId, "converged"]]);
    first = { fitId, proposalId, outcome, author };
  });

  it("re-runs the stored record to bit-identical values and does not save the re-run as a revision", async () => {
    if (!first) throw new Error("needs the converged fit of the previous test");
    const { fitId, proposalId, outcome, author } = first;
    const before = await revisionCount(proposalId);
    const res = await author.json(`/api/fits/${fitId}/rerun`, "POST", {});
    expect(res.status).toBe(202);
    const { fitId: rerunId } = (await res.json()) as { fitId: string };
    const row = await finishedFit(rerunId);
    expect(row.status).toBe("converged");
    expect(row.rerunOf).toBe(fitId);
    const again = row.outcome as FitOutcome;
    expect(again.values).toEqual(outcome.values);
    expect(again.standardErrors).toEqual(outcome.standardErrors);
    expect([again.cost, again.iterations, again.rms, again.starts]).toEqual([outcome.cost, outcome.iterations, outcome.rms, outcome.starts]);
    expect(row.resultRevisionId).toBeNull();
    expect(row.applyNote).toMatch(/re-run .*not saved as a revision/);
    expect(await revisionCount(proposalId)).toBe(before);
    // The runs list says so beside the re-run.
    const { fits } = (await (await author.fetch(`/api/proposals/${proposalId}/fits`)).json()) as { fits: FitRunView[] };
    expect(fits.find((f) => f.id === rerunId)?.reproduced).toEqual({ identical: true, maxDifference: 0, sameEngine: true });
    expect(fits.find((f) => f.id === fitId)?.reproduced).toBeNull();
  });
});

describe("refit input, preview and roles", () => {
  it("refuses bad settings before any job exists, with a message naming the problem", async () => {
    const { world, proposalId, referenceId, author } = await chainProposal();
    const other = await chainProposal(12);
    const twoPoints = JSON.stringify({ format: "bandgate-reference-bands", version: 1, energyUnit: "eV", k: { kind: "index", values: [0, 50] }, energies: [[-7.8, 6.7], [-6.6, 3.1]] });
    const few = await uploadReferenceBands(world.author, { proposalId, name: "two k-points", fileName: "two.json", content: twoPoints, provenance: PROVENANCE });
    const refused = async (body: unknown, status: number, message: RegExp) => {
      const res = await author.json(`/api/proposals/${proposalId}/fits`, "POST", body);
      const { error } = (await res.json()) as { error: { message: string; fieldErrors?: Record<string, string[]> } };
      expect(res.status, error.message).toBe(status);
      expect(`${error.message} ${JSON.stringify(error.fieldErrors ?? {})}`).toMatch(message);
    };
    await refused(chainSpec(few.referenceId), 422, /4 reference points for 5 free parameters/);
    await refused(chainSpec(referenceId, { window: [100, 200] }), 422, /window \[100, 200\] eV holds no reference band energies/);
    await refused({ referenceSetId: referenceId, parameters: [{ key: "onsite/A/s", lower: -4.5 }] }, 422, /start value -4\.6 of ε\(A, s\) lies outside its bounds \[-4\.5, \+∞\]/);
    await refused({ referenceSetId: referenceId, parameters: [{ key: "onsite/A/dxy" }] }, 422, /unknown parameter key "onsite\/A\/dxy"/);
    // pp_pi cannot act along the chain's own axis (Slater & Koster 1954, Table I, n = ±1): nothing can determine it.
    await refused({ referenceSetId: referenceId, parameters: [{ key: "onsite/A/s" }, { key: "shell/A-A/1/pp_pi" }] }, 422, /No value in the fit changes with pp_pi \(A–A, shell 1\)/);
    // These two are caught by the settings' schema or the reference lookup: 400 with field errors (invalid input), not 422.
    await refused({ referenceSetId: referenceId, parameters: [{ key: "onsite/A/s", lower: -4, upper: -6 }] }, 400, /"parameters\.0\.upper":\["lower bound is above the upper bound"\]/);
    await refused(chainSpec(other.referenceId), 400, /not attached to this proposal/);
    expect(await fitRunCount(proposalId)).toBe(0);
  });

  it("stores no reference set with NaN in it (the engine's own NaN refusal: tests/unit/tb/analysis/fit.test.ts, validateFitInput)", async () => {
    // Uploads go through a server action (app/(workspace)/proposals/actions.ts), not an API route; this is its service.
    const { world, proposalId } = await chainProposal();
    const sets = async () => (await db.select().from(referenceBandSets).where(eq(referenceBandSets.proposalId, proposalId))).length;
    const before = await sets();
    const upload = (fileName: string, content: string) => uploadReferenceBands(world.author, { proposalId, name: "with NaN", fileName, content, provenance: PROVENANCE });
    const json = (row: string) => `{"format":"bandgate-reference-bands","version":1,"energyUnit":"eV","k":{"kind":"index","values":[0,1]},"energies":[[-7.8,6.7],${row}]}`;
    await expect(upload("nan.json", json(`["nan",6.6]`))).rejects.toThrow(/energies\[1\]\[0\]: must be a finite number/);
    await expect(upload("nan-token.json", json(`[NaN,6.6]`))).rejects.toThrow(/not valid JSON/);
    await expect(upload("nan.csv", "k_index,E1 (eV),E2 (eV)\n0,-7.8,6.7\n1,nan,6.6\n")).rejects.toThrow(/line 3, column 2 \(E1 \(eV\)\): 'nan' is not allowed: values must be finite numbers/);
    expect(await sets()).toBe(before);
  });

  it("previews the points, k-points and exclusions that the window, band offset and band weights select", async () => {
    const world = await createFitWorld(truth);
    const synthetic = JSON.parse(syntheticReference(truth, SIGMA, 5)) as { energies: number[][] };
    // A deep band below the model's two (matched by bandOffset 1) and one missing value.
    const energies: (number | null)[][] = synthetic.energies.map((row) => [-20, ...row]);
    energies[10][2] = null;
    const { proposalId, referenceId } = await proposalToFit(world, truth, CHAIN_START, JSON.stringify({ ...synthetic, energies }));
    const author = await signedIn(world.author);
    const window: [number, number] = [-6, 3];
    const preview = async (bandWeights: { band: number; weight: number }[]) => {
      const res = await author.json(`/api/proposals/${proposalId}/fits/preview`, "POST", chainSpec(referenceId, { bandOffset: 1, window, bandWeights }));
      expect(res.status).toBe(200);
      return res.json();
    };
    // Counted here from the file: alignment "none", so the window applies to the reference energies as given (ends included).
    const inWindow = (e: number | null) => e !== null && e >= window[0] && e <= window[1];
    const [lower, upper] = [1, 2].map((b) => energies.filter((row) => inWindow(row[b])).length);
    const total = energies.flat().filter((e) => e !== null).length;
    expect([lower, upper].every((n) => n > 5 && n < 100)).toBe(true);

    const both = await preview([{ band: 2, weight: 0.5 }]);
    expect(both).toMatchObject({ parameters: 5, points: lower + upper, excluded: total - lower - upper, shift: 0 });
    expect(both.kPoints).toBe(energies.filter((row) => inWindow(row[1]) || inWindow(row[2])).length);
    expect(both.perBand).toEqual([
      { modelBand: 0, referenceBand: 1, points: lower, minWeight: 1, maxWeight: 1 },
      { modelBand: 1, referenceBand: 2, points: upper, minWeight: 0.5, maxWeight: 0.5 },
    ]);
    const upperOnly = await preview([{ band: 1, weight: 0 }]);
    expect(upperOnly).toMatchObject({ points: upper, kPoints: energies.filter((row) => inWindow(row[2])).length, excluded: total - upper });
    expect(await fitRunCount(proposalId)).toBe(0);
  });

  it("lets only the proposal's author start and the starter cancel, keeps the list from consumers, and refuses applying a re-run or a stale version", async () => {
    const { world, proposalId, referenceId, author } = await chainProposal();
    const [reviewer, consumer, curator] = await Promise.all([signedIn(world.reviewer), signedIn(world.stranger), signedIn(world.curator)]);
    const code = async (res: Response) => [res.status, ((await res.json()) as { error?: { code: string } }).error?.code];
    expect(await code(await reviewer.json(`/api/proposals/${proposalId}/fits`, "POST", chainSpec(referenceId)))).toEqual([403, "forbidden:role"]);
    expect(await code(await consumer.fetch(`/api/proposals/${proposalId}/fits`))).toEqual([403, "forbidden:role"]);
    expect((await reviewer.fetch(`/api/proposals/${proposalId}/fits`)).status).toBe(200);
    const otherAuthor = await signedIn(await createPerson(["author"]));
    expect(await code(await otherAuthor.json(`/api/proposals/${proposalId}/fits`, "POST", chainSpec(referenceId)))).toEqual([403, "forbidden:move"]);

    // Far from the optimum and cut off after one step: not converged, so not saved, so it can meet a stale version.
    const unsaved = await startFitOverHttp(author, proposalId, chainSpec(referenceId, { maxIterations: 1 }));
    expect((await finishedFit(unsaved)).status).toBe("not_converged");
    const before = await versionOf(proposalId);
    expect(await code(await author.json(`/api/fits/${unsaved}/apply`, "POST", { version: before - 1 }))).toEqual([409, "conflict:stale"]);
    expect(await versionOf(proposalId)).toBe(before);

    const fitId = await startFitOverHttp(author, proposalId, chainSpec(referenceId));
    expect(await code(await curator.json(`/api/fits/${fitId}/cancel`, "POST", {}))).toEqual([403, "forbidden:fit"]);
    expect((await fitRow(fitId)).cancelRequestedAt).toBeNull();
    expect((await finishedFit(fitId)).status).toBe("converged");

    const rerun = await author.json(`/api/fits/${fitId}/rerun`, "POST", {});
    const { fitId: rerunId } = (await rerun.json()) as { fitId: string };
    await finishedFit(rerunId);
    const version = await versionOf(proposalId);
    expect(await code(await author.json(`/api/fits/${rerunId}/apply`, "POST", { version }))).toEqual([422, "refused:rerun"]);
    // Permission comes before freshness: a saved fit is refused as saved, whatever version is sent.
    expect(await code(await author.json(`/api/fits/${fitId}/apply`, "POST", { version: version - 1 }))).toEqual([422, "refused:applied"]);
    expect(await versionOf(proposalId)).toBe(version);
    expect(await fitRunCount(proposalId)).toBe(3);
  });
});

describe("refit lifecycle", () => {
  it("cancels a running fit within seconds, keeping its best point and saving no revision", async () => {
    // 3000 k-points and four restarts keep the fit busy for well over ten seconds (measured: 2500 points take about 3.5 s per start).
    const { proposalId, author, spec } = await diamondProposal(3000);
    const before = await revisionCount(proposalId);
    const fitId = await startFitOverHttp(author, proposalId, { ...spec, restarts: 4 });
    await waitFor("the fit's first iteration", async () => {
      const run = await fitRow(fitId);
      return run.status === "running" && run.iteration >= 1;
    });
    const res = await author.json(`/api/fits/${fitId}/cancel`, "POST", {});
    expect([res.status, await res.json()]).toEqual([200, { status: "running" }]);
    const row = await finishedFit(fitId, 5);
    expect(row.status).toBe("cancelled");
    expect((row.finishedAt as Date).getTime() - (row.cancelRequestedAt as Date).getTime()).toBeLessThan(5000);
    const outcome = row.outcome as FitOutcome;
    expect(outcome.status).toBe("cancelled");
    expect(outcome.start).toEqual(DIAMOND_KEYS.map((k) => DIAMOND_START[k as keyof typeof DIAMOND_START]));
    expect(outcome.values).not.toEqual(outcome.start);
    expect(outcome.cost).toBeLessThanOrEqual(row.costHistory[0][1]);
    expect(row.resultRevisionId).toBeNull();
    expect(row.applyNote).toMatch(/cancelled; its best point so far can be saved as a revision by hand/);
    expect(await revisionCount(proposalId)).toBe(before);
  });

  it("ends a fit cut off after one iteration as not converged with its best point, which the author then saves by hand", async () => {
    const { proposalId, referenceId, reference, author } = await chainProposal();
    const fitId = await startFitOverHttp(author, proposalId, chainSpec(referenceId, { maxIterations: 1 }));
    const row = await finishedFit(fitId);
    expect(row.status).toBe("not_converged");
    const outcome = row.outcome as FitOutcome;
    expect([outcome.iterations, outcome.reason]).toEqual([1, "no convergence in 1 iterations"]);
    expect(outcome.values).not.toEqual(outcome.start);
    // The cost at the start values, from the analytic bands: one accepted step must have lowered it.
    const start = { ...Object.fromEntries(CHAIN_KEYS.map((k) => [k, getParameter(truth, k)])), ...CHAIN_START };
    const kFrac = samplePath(truth).kFrac;
    const energies = (JSON.parse(reference) as { energies: number[][] }).energies;
    const startCost = energies.reduce((acc, row, k) => acc + analyticChainBands(start, kFrac[k][0]).reduce((a, e, b) => a + 0.5 * (e - row[b]) ** 2, 0), 0);
    expect(outcome.cost).toBeLessThan(startCost);
    expect(row.resultRevisionId).toBeNull();
    expect(row.applyNote).toMatch(/did not converge, so its best point was not saved as a revision/);

    const revisionsBefore = await revisionCount(proposalId);
    const version = await versionOf(proposalId);
    const res = await author.json(`/api/fits/${fitId}/apply`, "POST", { version });
    expect([res.status, await res.json()]).toEqual([201, { revision: revisionsBefore + 1, version: version + 1 }]);
    const after = await fitRow(fitId);
    expect(after.applyNote).toBeNull();
    const saved = await revisionDocument(after.resultRevisionId as string);
    CHAIN_KEYS.forEach((key, i) => expect(getParameter(saved.doc, key)).toBe(outcome.values[i]));
    expect(saved.row.note).toMatch(/not converged after 1 iterations \(best point\)/);
  });

  it("runs two fits of one proposal side by side: the first to finish becomes the revision, the other is saved by hand", async () => {
    // 1500 k-points: each fit takes about 4 s when both run at once (measured), well over the worker's one-second poll.
    const { proposalId, author, spec } = await diamondProposal(1500);
    const ids = [await startFitOverHttp(author, proposalId, spec), await startFitOverHttp(author, proposalId, { ...spec, window: [-13, 3] })];
    const rows = [await finishedFit(ids[0]), await finishedFit(ids[1])];
    expect(rows.map((r) => r.status)).toEqual(["converged", "converged"]);
    const [a, b] = rows.map((r) => ({ from: (r.startedAt as Date).getTime(), to: (r.finishedAt as Date).getTime() }));
    expect(a.from < b.to && b.from < a.to, "the two runs overlapped in time").toBe(true);
    const [saved, other] = rows[0].resultRevisionId ? rows : [rows[1], rows[0]];
    expect(saved.resultRevisionId).not.toBeNull();
    expect(other.resultRevisionId).toBeNull();
    expect((saved.finishedAt as Date).getTime()).toBeLessThanOrEqual((other.finishedAt as Date).getTime());
    const savedRevision = await revisionDocument(saved.resultRevisionId as string);
    expect(other.applyNote).toMatch(new RegExp(`^Revision ${savedRevision.row.number} was saved while this fit ran \\(it started from revision ${savedRevision.row.number - 1}\\)`));

    const res = await author.json(`/api/fits/${other.id}/apply`, "POST", { version: await versionOf(proposalId) });
    expect(res.status).toBe(201);
    expect(((await res.json()) as { revision: number }).revision).toBe(savedRevision.row.number + 1);
    const byHand = await revisionDocument((await fitRow(other.id)).resultRevisionId as string);
    const values = (other.outcome as FitOutcome).values;
    DIAMOND_KEYS.forEach((key, i) => expect(getParameter(byHand.doc, key)).toBe(values[i]));
  });
});

describe("saving a fit by hand after the proposal moved on", () => {
  async function latestDocument(proposalId: string) {
    const [row] = await db.select().from(revisions).where(eq(revisions.proposalId, proposalId)).orderBy(desc(revisions.number)).limit(1);
    return parseModelDocument(row.document);
  }

  it("refuses when a later revision changed a parameter the fit kept fixed, and keeps a later metadata-only change", async () => {
    const { world, proposalId, referenceId, author } = await chainProposal(23);
    const free = ["onsite/A/s", "shell/A-A/1/sp_sigma"];
    const fitId = await startFitOverHttp(author, proposalId, { referenceSetId: referenceId, parameters: free.map((key) => ({ key })), maxIterations: 1 });
    const outcome = (await finishedFit(fitId)).outcome as FitOutcome;

    // A later revision that only rewords the description: saving the fit on top of it loses nothing and keeps the wording.
    const reworded = { ...(await latestDocument(proposalId)), description: "reworded while the fit ran" };
    await saveRevision(world.author, { proposalId, version: await versionOf(proposalId), document: reworded, note: "wording" });
    const ok = await author.json(`/api/fits/${fitId}/apply`, "POST", { version: await versionOf(proposalId) });
    expect(ok.status).toBe(201);
    const saved = await revisionDocument((await fitRow(fitId)).resultRevisionId as string);
    expect(saved.doc.description).toBe("reworded while the fit ran");
    free.forEach((key, i) => expect(getParameter(saved.doc, key)).toBe(outcome.values[i]));

    // A second fit from that revision, then a revision that moves pp_sigma, which the fit held fixed: refused.
    const secondId = await startFitOverHttp(author, proposalId, { referenceSetId: referenceId, parameters: free.map((key) => ({ key })), maxIterations: 1 });
    const second = await finishedFit(secondId);
    const moved = setParameters(await latestDocument(proposalId), { "shell/A-A/1/pp_sigma": 2.2 });
    moved.provenance.citations["shell/A-A/1/pp_sigma"] = "changed by hand while a fit ran";
    await saveRevision(world.author, { proposalId, version: await versionOf(proposalId), document: moved, note: "pp_sigma by hand" });
    const count = await revisionCount(proposalId);
    const refused = await author.json(`/api/fits/${secondId}/apply`, "POST", { version: await versionOf(proposalId) });
    const body = (await refused.json()) as { error: { code: string; message: string } };
    expect([refused.status, body.error.code]).toEqual([422, "refused:superseded"]);
    expect(body.error.message).toMatch(/changed parameters this fit kept fixed .* saving it would undo them/);
    expect(await revisionCount(proposalId)).toBe(count);
    expect(second.resultRevisionId).toBeNull();
  });
});

