import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BandPlot, type BandSeries } from "@/app/_components/band-plot";
import { Markdown } from "@/app/_components/markdown";
import { SafetyNote } from "@/app/_components/safety-note";
import { loadMarkdownHtml } from "@/board/markdown-html";
import { runEngine } from "@/lib/engine-pool/engine";
import { serverEnv } from "@/lib/env";
import { getProposalView } from "@/board/proposal-view";
import { listReviewers } from "@/board/queries";
import { VERDICT_LABEL } from "@/board/stages";
import { changedParameters } from "@/board/submission";
import type { ParsedReferenceBands } from "@/lib/reference-bands";
import { requirePageUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { validityText } from "@/lib/families/view";
import { ChecksPanel } from "./checks-panel";
import { ParameterChanges } from "./parameter-changes";
import { ReferenceUploadForm } from "./reference-upload-form";
import { RevisionEditor } from "./revision-editor";
import { ReviewersPanel } from "./reviewers-panel";
import { ProposalHeading } from "./proposal-heading";
import { Section } from "./section";
import { StagePanel } from "./stage-panel";
import { VerdictForm } from "./verdict-form";
import { WaiverForm } from "./waiver-form";

export const metadata: Metadata = { title: "Proposal" };
export const dynamic = "force-dynamic";

export default async function ProposalPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(`/proposals/${id}`, [...BOARD_ROLES]);
  const view = /^[0-9a-f-]{36}$/i.test(id) ? await getProposalView(id, user) : null;
  if (!view) notFound();
  const { proposal, latest, latestDocument, baseDocument, may } = view;
  const htmlOf = await loadMarkdownHtml([proposal.rationale, ...view.verdicts.map((v) => v.summary)]);
  const candidates = may.manageReviewers ? (await listReviewers()).filter((r) => r.id !== proposal.authorId) : [];
  const comparison = latestDocument
    ? await runEngine("bandComparison", latestDocument, baseDocument, view.references.map((r) => ({ name: r.name, parsed: r.parsed as ParsedReferenceBands & { pointsTotal?: number } })))
    : null;
  const series: BandSeries[] = comparison
    ? [
        ...(comparison.base ? [{ role: "base" as const, label: `base ${view.baseVersion}`, energies: comparison.base }] : []),
        { role: "proposal" as const, label: `proposed r${latest?.number}`, energies: comparison.proposed },
        ...comparison.references.map((r) => ({ role: "reference" as const, label: `reference: ${r.name}`, energies: r.energies, distance: r.distance })),
      ]
    : [];
  return (
    <>
      <Link href="/board" className="text-sm text-copper-deep underline">
        ← Review board
      </Link>
      <ProposalHeading view={view}>
        <Link href={`/proposals/${proposal.id}/review`} className="mt-3 inline-block rounded-md border border-copper px-3 py-1.5 text-sm font-semibold text-copper-deep hover:bg-copper-pale">
          Open the review workspace: diff, bands, remarks →
        </Link>
        <Link href={`/proposals/${proposal.id}/fit`} className="ml-3 mt-3 inline-block rounded-md border border-rule px-3 py-1.5 text-sm font-semibold hover:bg-paper-deep">
          {may.startFit ? "Refit to reference bands →" : "Refits →"}
        </Link>
      </ProposalHeading>
      <div className="grid gap-8 lg:grid-cols-2 xl:grid-cols-[1fr_20rem_22rem]">
        <div className="min-w-0 space-y-8">
          {proposal.rationale ? (
            <Section title="Rationale">
              <Markdown html={htmlOf(proposal.rationale)} />
            </Section>
          ) : null}
        </div>
        <aside className="space-y-8">
          <Section title="Stage and gate">
            <StagePanel proposalId={proposal.id} version={proposal.version} hints={view.hints} />
            <dl className="mt-3 grid grid-cols-[1fr_auto] gap-1 text-sm">
              <dt>Fresh accept verdicts</dt>
              <dd className="num" data-testid="fresh-accepts">
                {view.facts.freshAccepts} / {view.facts.requiredAccepts}
              </dd>
              <dt>Open blocking remarks</dt>
              <dd className="num">{view.facts.openBlockingRemarks}</dd>
              <dt>Checks</dt>
              <dd>{view.facts.checksPassing ? "✓ pass" : view.facts.checksWaived ? "≈ waived" : "✕ fail"}</dd>
            </dl>
            {proposal.stage === "accepted" && may.curate ? (
              <Link href={`/registry/${view.familySlug}/release/${proposal.id}`} className="mt-3 inline-block rounded-md bg-copper px-4 py-2 font-semibold text-white hover:bg-copper-deep">
                Release this proposal…
              </Link>
            ) : null}
          </Section>
        </aside>
        <aside className="space-y-8">
          <Section title="Reviewers">
            <ReviewersPanel proposalId={proposal.id} version={proposal.version} reviewers={view.reviewers} candidates={candidates} canManage={may.manageReviewers} />
          </Section>
          <Section title="Verdicts">
            <ul className="mb-3 space-y-3 text-sm">
              {view.verdicts.map((v) => (
                <li key={v.id} className={v.fresh ? "" : "opacity-60"}>
                  <div>
                    <span className="font-semibold">{VERDICT_LABEL[v.verdict]}</span> by {v.reviewerName} on r{v.revision}
                    {v.fresh ? "" : <span className="ml-1 rounded bg-paper-deep px-1 text-xs">stale: the physics changed since</span>}
                  </div>
                  <Markdown html={htmlOf(v.summary)} />
                </li>
              ))}
              {view.verdicts.length === 0 ? <li className="text-ink-soft">No verdicts yet.</li> : null}
            </ul>
            {may.giveVerdict ? <VerdictForm proposalId={proposal.id} /> : null}
          </Section>
        </aside>
      </div>
      <div className="mt-8 space-y-8">
        {may.revise && latest ? (
          <Section title="Parameters">
            <RevisionEditor proposalId={proposal.id} version={proposal.version} document={latest.document} baseDocument={baseDocument} basisLimit={serverEnv().MODEL_BASIS_LIMIT} />
          </Section>
        ) : (
          <>
            {comparison ? (
              <Section title="Bands">
                <BandPlot title={`Bands of ${proposal.title}: base, proposed and reference`} distance={comparison.distance} ticks={comparison.ticks} series={series} />
              </Section>
            ) : null}
            {latestDocument ? (
              <Section title="Changed parameters">
                <ParameterChanges changes={changedParameters(baseDocument, latestDocument)} />
              </Section>
            ) : null}
          </>
        )}
        {latest ? (
          <Section title={`Checks of revision ${latest.number}`}>
            <ChecksPanel checks={latest.checkResults} waivedReason={latest.checksWaivedReason} />
            {may.waive ? <WaiverForm proposalId={proposal.id} version={proposal.version} /> : null}
          </Section>
        ) : null}
        <Section title="Reference bands">
          <ul className="mb-3 space-y-1 text-sm">
            {view.references.map((r) => (
              <li key={r.id}>
                <span className="font-semibold">{r.name}</span> <span className="num text-xs text-ink-soft">{r.fileName} · sha256 {r.sha256.slice(0, 12)}…</span>
                <span className="block text-xs text-ink-soft">
                  {Object.entries(r.provenance)
                    .filter(([, v]) => v)
                    .map(([k, v]) => `${k}: ${v}`)
                    .join(" · ")}
                </span>
              </li>
            ))}
            {view.references.length === 0 ? <li className="text-ink-soft">None attached.</li> : null}
          </ul>
          {may.revise ? <ReferenceUploadForm proposalId={proposal.id} /> : null}
        </Section>
        <Section title="Revisions">
          <ol className="space-y-1 text-sm">
            {view.revisions.map((r) => (
              <li key={r.id} className="grid grid-cols-[3rem_1fr] gap-2">
                <span className="num font-semibold">r{r.number}</span>
                <span>
                  {r.note || <em className="text-ink-soft">no note</em>}
                  <span className="num block text-xs text-ink-soft">
                    sha256 {r.sha256.slice(0, 12)}… · physics {r.physicsHash.slice(0, 12)}… · {r.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC
                    {r.checksPassing ? " · checks pass" : " · checks fail"}
                  </span>
                </span>
              </li>
            ))}
          </ol>
        </Section>
        {latestDocument ? <SafetyNote validity={validityText(latestDocument)} /> : null}
      </div>
    </>
  );
}
