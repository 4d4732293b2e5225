import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Markdown } from "@/app/_components/markdown";
import { SafetyNote } from "@/app/_components/safety-note";
import { loadMarkdownHtml } from "@/board/markdown-html";
import { getProposalView } from "@/board/proposal-view";
import { getRevisionDocument, listRemarks } from "@/board/queries";
import { anchorFromQuery, isDiscussionOpen, mayFlagBlocking, mayWriteRemark } from "@/board/remark-rules";
import { acceptanceBlockers } from "@/board/rules";
import { requirePageUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { validityText } from "@/lib/families/view";
import type { ParsedReferenceBands } from "@/lib/reference-bands";
import { runEngine } from "@/lib/engine-pool/engine";
import type { BandViewData } from "@/lib/review/band-view";
import { proposalSlug } from "@/lib/review/export-names";
import type { MetricsRow } from "@/lib/review/metrics";
import type { ParameterDiff } from "@/lib/review/param-diff";
import { RecentResults } from "@/lib/review/recent-results";
import { canonicalJson } from "@/lib/tb/canonical";
import { ProposalHeading } from "../proposal-heading";
import { Section } from "../section";
import { StagePanel } from "../stage-panel";
import { BandsWithMetrics } from "./bands-with-metrics";
import { ChecksGatePanel } from "./checks-gate-panel";
import { FitOriginSection } from "./fit-origin-panel";
import { ParameterDiffPanel } from "./parameter-diff-panel";
import { RemarksPanel } from "./remarks-panel";
import { parseSide, resolveSide } from "./revision-choice";
import { RevisionPairPicker } from "./revision-pair-picker";
import { TextDiffPanel } from "./text-diff-panel";
import { VerdictsPanel } from "./verdicts-panel";

export const metadata: Metadata = { title: "Review workspace" };

/**
 * Band views and metrics of recently viewed proposals, computed on engine threads: a page refresh (e.g. after a
 * remark) does not recompute them, and views arriving while one is computed wait for it rather than start another.
 */
const bandViews = new RecentResults<Promise<BandViewData>>(32);
const metricsTables = new RecentResults<Promise<MetricsRow[]>>(64);
const parameterDiffs = new RecentResults<Promise<ParameterDiff>>(64);
export const dynamic = "force-dynamic";

function remembered<T>(store: RecentResults<Promise<T>>, key: string, compute: () => Promise<T>): Promise<T> {
  const result = store.get(key, compute);
  result.catch(() => store.forget(key)); // a refused or failed computation is tried again on the next view
  return result;
}

type Search = Promise<{ from?: string; to?: string; remark?: string }>;

export default async function ReviewPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Search }) {
  const { id } = await params;
  const search = await searchParams;
  const user = await requirePageUser(`/proposals/${id}/review`, [...BOARD_ROLES]);
  const view = /^[0-9a-f-]{36}$/i.test(id) ? await getProposalView(id, user) : null;
  if (!view || !view.latest || !view.latestDocument) notFound();
  const { proposal, latest, latestDocument, baseDocument } = view;
  const base = `/proposals/${id}/review`;

  const from = await resolveSide(parseSide(search.from, baseDocument ? "base" : `r${Math.max(1, latest.number - 1)}`), baseDocument, view.baseVersion, (n) => getRevisionDocument(id, n));
  const to = await resolveSide(parseSide(search.to, `r${latest.number}`), baseDocument, view.baseVersion, (n) => getRevisionDocument(id, n));
  const window = latestDocument.validity.energyWindow ?? null;
  const references = view.references.map((r) => ({ id: r.id, name: r.name, parsed: r.parsed as ParsedReferenceBands & { pointsTotal?: number } }));
  // Keyed by immutable ids: the latest revision, the base release and the reference sets.
  const inputsKey = [latest.id, proposal.baseReleaseId ?? "none", ...references.map((r) => r.id)].join("|");
  // Revisions of a proposal and its base release never change, so the pair of sides names the diff for ever.
  const diffKey = [proposal.id, from.value, to.value, window ?? ""].join("|");
  const toDoc = to.doc;
  const diffResult = toDoc ? remembered(parameterDiffs, diffKey, () => runEngine("parameterDiff", from.doc, toDoc, { window: window ?? undefined })) : Promise.resolve(null);
  const bandViewResult = remembered(bandViews, inputsKey, () => runEngine("bandView", latestDocument, baseDocument, references));
  const [diff, bandView, remarkRows] = await Promise.all([diffResult, bandViewResult, listRemarks(id)]);
  const metricsSettings = { window, alignment: bandView.proposedVbm === null ? ("none" as const) : ("vbm" as const) };
  const metrics = await remembered(metricsTables, `${inputsKey}|${metricsSettings.alignment}|${window ?? ""}`, () =>
    runEngine("metrics", latestDocument, baseDocument, references[0] ?? null, metricsSettings),
  );
  const htmlOf = await loadMarkdownHtml([proposal.rationale, ...view.verdicts.map((v) => v.summary), ...remarkRows.map((r) => r.body)]);
  const remarks = remarkRows.map((r) => ({ ...r, bodyHtml: htmlOf(r.body) }));
  const verdicts = view.verdicts.map((v) => ({ ...v, summaryHtml: htmlOf(v.summary) }));
  const toRevision = view.revisions.find((r) => `r${r.number}` === to.value) ?? null;
  const ctx = { authorId: proposal.authorId, assignedReviewerIds: view.facts.assignedReviewerIds, familyCuratorIds: view.facts.familyCuratorIds };
  const discussionOpen = isDiscussionOpen(proposal.stage);
  const mayWrite = discussionOpen && mayWriteRemark(user, ctx);
  // "Remark on this" links only for those who may write one now.
  const remarkBase = mayWrite ? base : null;
  const options = [
    ...(baseDocument ? [{ value: "base", label: `base release ${view.baseVersion}` }] : []),
    ...view.revisions.map((r) => ({ value: `r${r.number}`, label: `revision ${r.number}${r.note ? ` — ${r.note}` : ""}` })),
  ];

  return (
    <>
      <Link href={`/proposals/${id}`} className="text-sm text-copper-deep underline">
        ← Proposal overview
      </Link>
      <ProposalHeading view={view} prefix="Review: " />

      <div className="grid gap-8 xl:grid-cols-[1fr_24rem]">
        <div className="min-w-0 space-y-10">
          {proposal.rationale ? (
            <Section title="Rationale">
              <Markdown html={htmlOf(proposal.rationale)} />
            </Section>
          ) : null}
          <Section title="What changed">
            <RevisionPairPicker options={options} from={from.value} to={to.value} />
            {diff ? <ParameterDiffPanel diff={diff} remarkBase={remarkBase} /> : <p className="text-sm text-ink-soft">That revision is not a valid document.</p>}
            <details className="mt-4">
              <summary className="cursor-pointer text-sm font-semibold">Canonical document, line by line</summary>
              <div className="mt-2">
                <TextDiffPanel
                  before={from.doc ? canonicalJson(from.doc, { pretty: true }) : ""}
                  after={to.doc ? canonicalJson(to.doc, { pretty: true }) : ""}
                  beforeLabel={from.label}
                  afterLabel={to.label}
                />
              </div>
            </details>
          </Section>
          {toRevision && to.doc ? (
            <FitOriginSection proposalId={id} revisionId={toRevision.id} revisionNumber={toRevision.number} document={to.doc} />
          ) : null}
          <Section title="What it does to the bands">
            <BandsWithMetrics proposalId={id} data={bandView} remarkBase={remarkBase} slug={proposalSlug(proposal.title)} initial={metricsSettings} initialRows={metrics} />
          </Section>
          <Section title={`Checks and gate (revision ${latest.number})`}>
            <ChecksGatePanel checks={latest.checkResults} criteria={view.criteria} waivedReason={latest.checksWaivedReason} gateReasons={acceptanceBlockers(view.facts)} />
          </Section>
          <SafetyNote validity={validityText(latestDocument)} />
        </div>
        <aside className="space-y-8">
          <Section title="Stage">
            <StagePanel proposalId={proposal.id} version={proposal.version} hints={view.hints} />
          </Section>
          <Section title="Verdicts">
            <VerdictsPanel proposalId={proposal.id} verdicts={verdicts} required={view.facts.requiredAccepts} fresh={view.facts.freshAccepts} mayGive={view.may.giveVerdict} />
          </Section>
          <div id="remarks">
            <Section title="Remarks">
              <RemarksPanel
                proposalId={proposal.id}
                remarks={remarks}
                viewer={user}
                ctx={ctx}
                latestRevision={latest.number}
                open={discussionOpen}
                mayWrite={mayWrite}
                mayBlock={mayFlagBlocking(user, ctx)}
                anchorForNew={anchorFromQuery(search.remark)}
                clearAnchorHref={`${base}#remarks`}
              />
            </Section>
          </div>
        </aside>
      </div>
    </>
  );
}
