import { uploadReferenceBands } from "@/board/reference-upload";
import type { SessionUser } from "@/lib/auth/session-user";
import { createFitRun } from "@/lib/fits/service";
import { runFitInline } from "@/lib/fits/run-inline";
import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";
import { computeBands } from "@/lib/tb/bands";
import type { ModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { compileModel } from "@/lib/tb/model";
import { getParameter, setParameters } from "@/lib/tb/parameters";

/**
 * Invented reference bands for the demo: the bands of the released model with a few hidden parameter changes,
 * plus 3 meV of seeded noise, so a refit has something to find. Nothing here comes from a real calculation.
 */
const HIDDEN: Record<string, Record<string, number>> = {
  "sp-chain": { "shell/A-A/1/ss_sigma": 1.05, "shell/A-A/1/pp_sigma": 0.95, "onsite/A/pz": 1.04 },
  "honeycomb-pz": { "shell/C-C/1/pp_pi": 1.03 },
  "diamond-sp3s": { "shell/X-X/1/sp_sigma": 1.04, "shell/X-X/1/pp_pi": 0.96, "shell/X-X/1/ss_sigma": 1.02 },
};

const NOISE_EV = 0.003;

function referenceJson(doc: ModelDocument, slug: string, seed: number): string {
  const hidden = setParameters(doc, Object.fromEntries(Object.entries(HIDDEN[slug] ?? {}).map(([k, f]) => [k, getParameter(doc, k) * f])));
  const path = samplePath(hidden);
  const uniform = seededUniform(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  const energies = computeBands(compileModel(hidden), path.kFrac).energies.map((row) => Array.from(row, (e) => Math.round((e + NOISE_EV * normal()) * 1e5) / 1e5));
  return JSON.stringify({ format: "bandgate-reference-bands", version: 1, energyUnit: "eV", k: { kind: "index", values: path.kFrac.map((_, i) => i) }, energies });
}

export async function attachDemoReference(author: SessionUser, proposalId: string, doc: ModelDocument, slug: string, seed: number): Promise<string> {
  const { referenceId } = await uploadReferenceBands(author, {
    proposalId,
    name: "Invented reference bands (demo)",
    fileName: `demo-${slug}-reference.json`,
    content: referenceJson(doc, slug, seed),
    provenance: {
      method: "invented for the demo: bands of hidden parameter changes plus 3 meV seeded noise",
      code: "Bandgate demo seed",
      structureSource: "the family's released structure",
      notes: "Not from any real calculation.",
    },
  });
  return referenceId;
}

/** A finished refit of the hidden parameters, run in the seed itself so the demo shows a fit record at once. */
export async function demoRefit(author: SessionUser, proposalId: string, referenceId: string, slug: string): Promise<void> {
  const keys = Object.keys(HIDDEN[slug] ?? {});
  if (keys.length === 0) return;
  const { fitId } = await createFitRun(author, proposalId, { referenceSetId: referenceId, parameters: keys.map((key) => ({ key })) });
  await runFitInline(fitId);
}
