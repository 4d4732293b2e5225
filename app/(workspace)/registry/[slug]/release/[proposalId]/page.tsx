import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageTitle } from "@/app/_components/page-title";
import { getReleaseDraft } from "@/board/release-draft";
import { requirePageUser } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { documentHash } from "@/lib/tb/canonical";
import { ReleaseForm } from "./release-form";

export const metadata: Metadata = { title: "Release a proposal" };
export const dynamic = "force-dynamic";

const LEVEL_TEXT = { major: "major (the basis or bond list changes shape)", minor: "minor (parameter values)", patch: "patch (metadata only)" } as const;

export default async function ReleaseProposalPage({ params }: { params: Promise<{ slug: string; proposalId: string }> }) {
  const { slug, proposalId } = await params;
  const user = await requirePageUser(`/registry/${slug}/release/${proposalId}`, ["curator"]);
  if (!/^[0-9a-f-]{36}$/i.test(proposalId)) notFound();
  const draft = await getReleaseDraft(user, proposalId).catch((err) => {
    if (err instanceof AppError && err.kind === "not-found") return null;
    throw err;
  });
  if (!draft || draft.familySlug !== slug) notFound();
  return (
    <>
      <Link href={`/proposals/${draft.proposalId}`} className="text-sm text-copper-deep underline">
        ← {draft.title}
      </Link>
      <PageTitle title={`Release to ${draft.familyTitle}`} lead="A release is fixed forever: its document, version, checksum and changelog can never be edited, only deprecated or withdrawn later." />
      <dl className="mb-6 grid max-w-3xl grid-cols-[12rem_1fr] gap-2 text-sm">
        <dt className="text-ink-soft">Proposal</dt>
        <dd>
          {draft.title} · base {draft.baseVersion ?? "none"} → revision {draft.revision}
        </dd>
        <dt className="text-ink-soft">Change</dt>
        <dd data-testid="change-level">
          {LEVEL_TEXT[draft.assessment.level]}
          <ul className="list-disc pl-5 text-ink-soft">
            {draft.assessment.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </dd>
        <dt className="text-ink-soft">Existing versions</dt>
        <dd className="num">{draft.existing.length ? draft.existing.join(", ") : "none"}</dd>
        <dt className="text-ink-soft">Document sha256</dt>
        <dd className="num break-all">{documentHash(draft.document)}</dd>
      </dl>
      {draft.mayRelease ? (
        <ReleaseForm proposalId={draft.proposalId} version={draft.proposalVersion} suggested={draft.suggested} changelog={draft.changelog} />
      ) : (
        <p className="text-ink-soft">
          {draft.stage === "accepted" ? "Only a curator of this family may release it." : "Only an accepted proposal can be released."}
        </p>
      )}
    </>
  );
}
