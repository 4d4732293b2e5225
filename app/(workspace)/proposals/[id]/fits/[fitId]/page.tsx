import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CostHistoryPlot } from "@/app/_components/cost-history-plot";
import { SafetyNote } from "@/app/_components/safety-note";
import { getProposalView } from "@/board/proposal-view";
import { db } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { validityText } from "@/lib/families/view";
import { runEngine } from "@/lib/engine-pool/engine";
import { loadFitContext } from "@/lib/fits/context";
import { getFitRun, listReruns } from "@/lib/fits/queries";
import { compareReproduction } from "@/lib/fits/reproduce";
import { describeFitWeights } from "@/lib/fits/result-document";
import { fitRunView } from "@/lib/fits/view";
import { parameterLabels, setParameters } from "@/lib/tb/parameters";
import { ProposalHeading } from "../../proposal-heading";
import { Section } from "../../section";
import { CorrelationMatrix } from "./correlation-matrix";
import { FitQualityFigures } from "./fit-quality";
import { ParameterResults } from "./parameter-results";
import { RerunButton } from "./rerun-button";

export const metadata: Metadata = { title: "Fit record" };
export const dynamic = "force-dynamic";

const UUID = /^[0-9a-f-]{36}$/i;

export default async function FitRecordPage({ params }: { params: Promise<{ id: string; fitId: string }> }) {
  const { id, fitId } = await params;
  const user = await requirePageUser(`/proposals/${id}/fits/${fitId}`, [...BOARD_ROLES]);
  const row = UUID.test(id) && UUID.test(fitId) ? await getFitRun(db, fitId) : null;
  if (!row || row.run.proposalId !== id) notFound();
  const view = await getProposalView(id, user);
  if (!view) notFound();
  const { run } = row;
  const fit = fitRunView(row);
  const ctx = await loadFitContext(db, id, run.referenceSetId, run.baseRevisionId);
  const outcome = run.outcome;
  // The plots need only the fitted values (the provenance the revision carries does not change a band).
  const fitted = outcome ? setParameters(ctx.document, Object.fromEntries(outcome.names.map((k, i) => [k, outcome.values[i]]))) : null;
  const quality = outcome && fitted ? await runEngine("fitQuality", ctx.document, fitted, ctx.parsedReference, run.spec, outcome) : null;
  const original = run.rerunOf ? await getFitRun(db, run.rerunOf) : null;
  const reruns = await listReruns(db, run.id);
  const comparisons = [
    ...(original?.run.outcome && outcome ? [{ label: "this re-run against the original fit", id: original.run.id, result: compareReproduction(original.run.outcome, outcome, original.run.engineVersion === run.engineVersion) }] : []),
    ...reruns.flatMap((r) => (r.run.outcome && outcome ? [{ label: `re-run by ${r.startedByName}`, id: r.run.id, result: compareReproduction(outcome, r.run.outcome, r.run.engineVersion === run.engineVersion) }] : [])),
  ];
  const spec = run.spec;
  const labels = parameterLabels(ctx.document);
  return (
    <>
      <Link href={`/proposals/${id}/fit`} className="text-sm text-copper-deep underline">
        ← Refits of this proposal
      </Link>
      <ProposalHeading view={view} prefix="Fit record: " />
      <div className="space-y-10">
        <Section title="Outcome">
          <dl className="grid max-w-3xl grid-cols-[14rem_1fr] gap-x-4 gap-y-1 text-sm" data-testid="fit-outcome">
            <dt>Status</dt>
            <dd className="font-semibold">{fit.statusLabel}{outcome ? ` — ${outcome.reason}` : ""}</dd>
            {outcome ? (
              <>
                <dt>RMS / max error in the fit</dt>
                <dd className="num">{(outcome.rms * 1000).toFixed(2)} meV / {(outcome.maxAbs * 1000).toFixed(2)} meV over {outcome.points} values</dd>
                <dt>Iterations, time</dt>
                <dd className="num">{outcome.iterations} iterations in {(outcome.elapsedMs / 1000).toFixed(2)} s</dd>
                <dt>Alignment shift</dt>
                <dd className="num">{outcome.shift.toFixed(4)} eV added to the reference</dd>
                <dt>Residual variance</dt>
                <dd className="num">{outcome.residualVariance.toExponential(3)} eV² (weighted)</dd>
              </>
            ) : null}
            <dt>Result</dt>
            <dd>
              {row.resultRevisionNumber !== null ? (
                <Link className="underline" href={`/proposals/${id}/review?to=r${row.resultRevisionNumber}`}>
                  revision {row.resultRevisionNumber}
                </Link>
              ) : (
                (run.applyNote ?? run.failureReason ?? "not saved as a revision")
              )}
            </dd>
            {run.failureReason && run.status !== "failed" ? (
              <>
                <dt>Earlier attempts</dt>
                <dd>{run.failureReason}</dd>
              </>
            ) : null}
            <dt>Attempts</dt>
            <dd className="num">
              {run.attempts}
              {run.crashes > 0 ? ` (${run.crashes} ended in a crash)` : ""}
            </dd>
            {fit.resumed ? (
              <>
                <dt>Interruptions</dt>
                <dd data-testid="fit-resumed">{fit.resumed}</dd>
              </>
            ) : null}
          </dl>
        </Section>
        <Section title="Inputs (enough to run it again)">
          <dl className="grid max-w-3xl grid-cols-[14rem_1fr] gap-x-4 gap-y-1 text-sm">
            <dt>Start values</dt>
            <dd>revision {row.baseRevisionNumber} (sha256 {ctx.revision.sha256.slice(0, 12)}…)</dd>
            <dt>Reference bands</dt>
            <dd>
              {ctx.reference.name} <span className="num text-xs text-ink-soft">sha256 {ctx.reference.sha256.slice(0, 12)}…</span>
            </dd>
            <dt>Free parameters</dt>
            <dd className="num">{spec.parameters.map((p) => p.key).join(", ")}</dd>
            <dt>Window</dt>
            <dd className="num">{spec.window ? `[${spec.window[0]}, ${spec.window[1]}] eV` : "every energy"}</dd>
            <dt>Weights and alignment</dt>
            <dd>{describeFitWeights(spec)}</dd>
            <dt>Limits</dt>
            <dd className="num">at most {spec.maxIterations} iterations; {spec.restarts} extra start{spec.restarts === 1 ? "" : "s"}; seed {spec.seed}</dd>
            <dt>Engine</dt>
            <dd className="num">bandgate tight-binding engine {run.engineVersion}</dd>
            <dt>Whole record</dt>
            <dd>
              <a href={`/api/fits/${run.id}`} className="underline" download={`fit-${run.id.slice(0, 8)}.json`}>
                download as JSON
              </a>{" "}
              (status, settings, outcome with standard errors and correlations, cost history)
            </dd>
            <dt>Started</dt>
            <dd>
              by {row.startedByName}, {run.createdAt.toISOString().slice(0, 19).replace("T", " ")} UTC
            </dd>
          </dl>
        </Section>
        {outcome ? (
          <>
            <Section title="Parameters">
              <ParameterResults outcome={outcome} spec={spec} labels={labels} />
              {!outcome.standardErrors ? <p className="mt-2 text-sm text-danger">Uncertainties could not be estimated: the reference does not determine every free parameter (JᵀJ is singular).</p> : null}
            </Section>
            {outcome.correlations && outcome.names.length > 1 ? (
              <Section title="Correlations">
                <CorrelationMatrix names={outcome.names} correlations={outcome.correlations} labels={labels} />
              </Section>
            ) : null}
            <Section title="Fit quality">
              {quality ? <FitQualityFigures quality={quality} referenceName={ctx.reference.name} /> : null}
              <table className="mt-3 text-sm">
                <caption className="sr-only">Error per band</caption>
                <thead className="text-left text-xs text-ink-soft">
                  <tr>
                    <th className="pr-4">Model band</th>
                    <th className="pr-4">Reference band</th>
                    <th className="pr-4 text-right">Values</th>
                    <th className="pr-4 text-right">RMS (meV)</th>
                    <th className="text-right">Max (meV)</th>
                  </tr>
                </thead>
                <tbody>
                  {outcome.perBand.map((b) => (
                    <tr key={b.modelBand} className="border-t border-rule">
                      <td className="num">{b.modelBand}</td>
                      <td className="num">{b.referenceBand}</td>
                      <td className="num pr-4 text-right">{b.points}</td>
                      <td className="num pr-4 text-right">{(b.rms * 1000).toFixed(2)}</td>
                      <td className="num text-right">{(b.maxAbs * 1000).toFixed(2)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </Section>
          </>
        ) : null}
        <Section title="Cost per iteration">
          <CostHistoryPlot history={run.costHistory} title="Cost ½Σw·ΔE² per accepted iteration, log scale" />
          {outcome && outcome.starts.length > 1 ? (
            <table className="mt-3 text-sm">
              <caption className="mb-1 text-left text-xs text-ink-soft">Starts (the best is kept)</caption>
              <tbody>
                {outcome.starts.map((s, i) => (
                  <tr key={i} className="border-t border-rule">
                    <td className="pr-4">{i === 0 ? "revision values" : `seeded start ${i}`}</td>
                    <td className="pr-4">{s.status}</td>
                    <td className="num pr-4 text-right">{s.iterations} it.</td>
                    <td className="num text-right">cost {s.cost.toExponential(3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
        </Section>
        <Section title="Reproducibility">
          {comparisons.length === 0 ? <p className="text-sm text-ink-soft">Not re-run yet. A re-run repeats this record exactly (same revision, reference, settings and seed) and must give the same values.</p> : null}
          {fit.resumed ? (
            <p className="text-sm text-ink-soft">
              This run was resumed from checkpoints. A resumed fit continues the minimiser exactly where it stood, so its values do not depend on the
              interruptions: a re-run in one go must give the same values, and a difference would show here.
            </p>
          ) : null}
          {view.may.rerunFit && !fit.active && run.status !== "failed" ? <RerunButton proposalId={id} fitId={run.id} /> : null}
          <ul className="space-y-1 text-sm" data-testid="fit-reproduction">
            {comparisons.map((c) => (
              <li key={c.id}>
                <Link href={`/proposals/${id}/fits/${c.id}`} className="underline">
                  {c.label}
                </Link>
                :{" "}
                {c.result.identical ? (
                  <strong className="text-ok">identical values ✓</strong>
                ) : (
                  <strong className="text-danger">differs by up to {c.result.maxDifference.toExponential(2)} eV</strong>
                )}
                {c.result.sameEngine ? "" : " (different engine version)"}
              </li>
            ))}
          </ul>
        </Section>
        <SafetyNote validity={validityText(ctx.document)} />
      </div>
    </>
  );
}
