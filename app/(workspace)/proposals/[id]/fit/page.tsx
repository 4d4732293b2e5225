import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getProposalView } from "@/board/proposal-view";
import type { ParsedReferenceBands } from "@/lib/reference-bands";
import { requirePageUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { listParameters } from "@/lib/tb/parameters";
import { ProposalHeading } from "../proposal-heading";
import { Section } from "../section";
import { FitForm } from "./fit-form";
import { FitRuns } from "./fit-runs";

export const metadata: Metadata = { title: "Refit" };
export const dynamic = "force-dynamic";

export default async function FitPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(`/proposals/${id}/fit`, [...BOARD_ROLES]);
  const view = /^[0-9a-f-]{36}$/i.test(id) ? await getProposalView(id, user) : null;
  if (!view || !view.latest || !view.latestDocument) notFound();
  const { proposal, latest, latestDocument, may } = view;
  const references = view.references.map((r) => {
    const parsed = r.parsed as ParsedReferenceBands;
    return { id: r.id, name: r.name, points: parsed.pointCount, bands: parsed.bandCount };
  });
  const parameters = listParameters(latestDocument).map((p) => ({ key: p.key, label: p.label, value: p.value }));
  return (
    <>
      <Link href={`/proposals/${id}`} className="text-sm text-copper-deep underline">
        ← Proposal overview
      </Link>
      <ProposalHeading view={view} prefix="Refit: " />
      <div className="space-y-10">
        <Section title={`New refit, starting from revision ${latest.number}`}>
          {references.length === 0 ? (
            <p className="text-sm text-ink-soft">
              Attach reference bands to this proposal first (on the <Link href={`/proposals/${id}`} className="underline">overview</Link>, under “Reference bands”).
            </p>
          ) : (
            <FitForm proposalId={proposal.id} parameters={parameters} references={references} canStart={may.startFit} />
          )}
        </Section>
        <Section title="Refits">
          <FitRuns proposalId={proposal.id} viewerId={user.id} isAdmin={user.roles.includes("admin")} canSave={may.revise} canRerun={may.rerunFit} version={proposal.version} />
        </Section>
      </div>
    </>
  );
}
