import Link from "next/link";
import { db } from "@/db/client";
import { loadFitContext } from "@/lib/fits/context";
import { runEngine } from "@/lib/engine-pool/engine";
import { getFitOfRevision } from "@/lib/fits/queries";
import { describeFitWeights } from "@/lib/fits/result-document";
import { parameterLabels } from "@/lib/tb/parameters";
import type { ModelDocument } from "@/lib/tb/document";
import { FitQualityFigures } from "../fits/[fitId]/fit-quality";
import { ParameterResults } from "../fits/[fitId]/parameter-results";
import { Section } from "../section";

/** When the revision under review came from a refit: how its numbers were obtained, with the fit-quality plot. */
export async function FitOriginSection({ proposalId, revisionId, revisionNumber, document }: { proposalId: string; revisionId: string; revisionNumber: number; document: ModelDocument }) {
  const row = await getFitOfRevision(db, revisionId);
  if (!row || !row.run.outcome) return null;
  const { run } = row;
  const outcome = run.outcome!;
  const ctx = await loadFitContext(db, proposalId, run.referenceSetId, run.baseRevisionId);
  const quality = await runEngine("fitQuality", ctx.document, document, ctx.parsedReference, run.spec, outcome);
  return (
    <Section title="How these numbers were obtained">
    <div data-testid="fit-origin">
      <p className="mb-3 text-sm">
        Revision {revisionNumber} is the result of a refit of revision {row.baseRevisionNumber} to “{row.referenceName}” by {row.startedByName}: {outcome.names.length} free parameter{outcome.names.length === 1 ? "" : "s"},{" "}
        {spec(run.spec.window)}, {describeFitWeights(run.spec)}; RMS <span className="num">{(outcome.rms * 1000).toFixed(2)}</span> meV, max{" "}
        <span className="num">{(outcome.maxAbs * 1000).toFixed(2)}</span> meV over {outcome.points} values, {outcome.status} in {outcome.iterations} iterations.{" "}
        <Link href={`/proposals/${proposalId}/fits/${run.id}`} className="text-copper-deep underline">
          Full fit record (inputs, cost history, correlations, re-runs) →
        </Link>
      </p>
      <ParameterResults outcome={outcome} spec={run.spec} labels={parameterLabels(ctx.document)} />
      <div className="mt-4">
        <FitQualityFigures quality={quality} referenceName={row.referenceName} />
      </div>
    </div>
    </Section>
  );
}

function spec(window: [number, number] | null): string {
  return window ? `window [${window[0]}, ${window[1]}] eV` : "every energy";
}
