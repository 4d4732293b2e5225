import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { listFamiliesWithCurators, listFamilyReleases } from "@/board/queries";
import { requirePageUser } from "@/lib/auth/guard";
import { NewProposalForm } from "./new-proposal-form";

export const metadata: Metadata = { title: "New proposal" };
export const dynamic = "force-dynamic";

export default async function NewProposalPage({ searchParams }: { searchParams: Promise<{ family?: string }> }) {
  await requirePageUser("/proposals/new", ["author"]);
  const { family } = await searchParams;
  const families = await listFamiliesWithCurators();
  const choices = await Promise.all(families.map(async (f) => ({ slug: f.slug, title: f.title, releases: await listFamilyReleases(f.id) })));
  return (
    <>
      <PageTitle title="New proposal" lead="A proposal starts as a draft with the base release's parameters; edit them, attach reference bands, then submit." />
      <NewProposalForm families={choices} initialFamily={family ?? null} />
    </>
  );
}
