import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BandPlot } from "@/app/_components/band-plot";
import { FormMessage } from "@/app/_components/form-parts";
import { PageTitle } from "@/app/_components/page-title";
import { SafetyNote } from "@/app/_components/safety-note";
import { requirePageUser } from "@/lib/auth/guard";
import { getCurrentFamilyDocument, getFamilyBySlug } from "@/lib/families/queries";
import { runEngine } from "@/lib/engine-pool/engine";
import { ParameterTable } from "./parameter-table";

export const metadata: Metadata = { title: "Model family" };
export const dynamic = "force-dynamic";

export default async function FamilyPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  await requirePageUser(`/families/${slug}`);
  const family = await getFamilyBySlug(slug);
  if (!family) notFound();
  const current = await getCurrentFamilyDocument(family.id, family.startingDocument);
  const result = current ? await runEngine("modelView", current.document) : null;
  return (
    <>
      <PageTitle title={family.title} lead={family.description} />
      {family.isDemo ? (
        <p className="mb-4 inline-block rounded bg-paper-deep px-2 py-0.5 text-sm">Demo family: every value here is invented for illustration.</p>
      ) : null}
      <p className="mb-4 flex flex-wrap gap-4 text-sm">
        <Link href={`/board?family=${family.slug}`} className="text-copper-deep underline">
          Proposals of this family on the board
        </Link>
        <Link href={`/proposals/new?family=${family.slug}`} className="text-copper-deep underline">
          Propose a change
        </Link>
        {current ? <span className="text-ink-soft">Showing the {current.label}.</span> : null}
      </p>
      {!result ? <p className="text-ink-soft">This family has no parameter set yet; its first proposal starts from a blank model.</p> : null}
      {result && !result.ok ? (
        <FormMessage kind="error">
          The stored parameter set does not validate: {result.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}
        </FormMessage>
      ) : null}
      {result?.ok ? (
        <div className="space-y-8">
          <div className="grid gap-6 lg:grid-cols-[1fr_18rem]">
            <BandPlot
              title={`Bands of ${result.view.doc.name} along the default path`}
              distance={result.view.path.distance}
              ticks={result.view.path.ticks}
              series={[{ role: "proposal", label: `${result.view.doc.name} (${current?.label})`, energies: result.view.path.energies }]}
              fermiLevel={result.view.fermiLevel}
            />
            <dl className="space-y-3 text-sm">
              <div>
                <dt className="text-ink-soft">Band gap on the path</dt>
                <dd className="num">{result.view.gap.text}</dd>
              </div>
              <div>
                <dt className="text-ink-soft">Basis size</dt>
                <dd className="num">{result.view.basisSize} orbitals per cell</dd>
              </div>
              <div>
                <dt className="text-ink-soft">Electrons per cell</dt>
                <dd className="num">{result.view.doc.electronCount}</dd>
              </div>
              <div>
                <dt className="text-ink-soft">Energy zero</dt>
                <dd>{result.view.doc.conventions.energyZero}</dd>
              </div>
              <div>
                <dt className="text-ink-soft">Reference</dt>
                <dd>{result.view.doc.provenance.referenceMethod}</dd>
              </div>
            </dl>
          </div>
          <SafetyNote validity={result.view.validity} />
          <ParameterTable parameters={result.view.parameters} citations={result.view.doc.provenance.citations} />
        </div>
      ) : null}
    </>
  );
}
