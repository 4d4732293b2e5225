import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BandPlot } from "@/app/_components/band-plot";
import { FormMessage } from "@/app/_components/form-parts";
import { Markdown } from "@/app/_components/markdown";
import { SafetyNote } from "@/app/_components/safety-note";
import { loadMarkdownHtml } from "@/board/markdown-html";
import { requirePageUser } from "@/lib/auth/guard";
import { StatusBadge } from "../../status-badge";
import { CurationForms } from "./curation-forms";
import { ModelFacts } from "./model-facts";
import { getReleasePageView, pullCommand } from "./release-view";

export const metadata: Metadata = { title: "Release" };
export const dynamic = "force-dynamic";

const DOWNLOADS = [
  { file: "model-document.json", label: "Model document (canonical JSON)" },
  { file: "hoppings.csv", label: "Real-space hopping list (CSV)" },
  { file: "hoppings.json", label: "Real-space hopping list (JSON)" },
  { file: "bands.csv", label: "Bands on the default path (CSV)" },
];

function Block({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section aria-label={title}>
      <h2 className="mb-2 text-lg font-semibold">{title}</h2>
      {children}
    </section>
  );
}

export default async function ReleasePage({ params }: { params: Promise<{ slug: string; version: string }> }) {
  const { slug, version } = await params;
  const user = await requirePageUser(`/registry/${slug}/${version}`);
  const view = await getReleasePageView(user, slug, version);
  if (!view) notFound();
  const { family, release, model } = view;
  const htmlOf = await loadMarkdownHtml([release.changelog]);
  return (
    <>
      <Link href={`/registry/${family.slug}`} className="text-sm text-copper-deep underline">
        ← {family.title}
      </Link>
      <header className="mb-6 mt-2">
        <h1 className="text-2xl font-semibold tracking-tight">
          {family.title} <span className="num" data-testid="release-version">{release.version}</span>
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-3 text-sm">
          <StatusBadge status={view.status} />
          <span className="text-ink-soft">released {release.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC</span>
        </p>
        <p className="num mt-2 break-all text-sm">
          sha256 <span data-testid="release-sha256">{release.sha256}</span>
        </p>
      </header>
      {release.withdrawnAt ? (
        <FormMessage kind="error">Withdrawn on {release.withdrawnAt.toISOString().slice(0, 10)}: {release.withdrawalReason}. It stays readable; do not start new work from it.</FormMessage>
      ) : null}
      {release.deprecatedAt ? (
        <FormMessage kind="error">
          Deprecated on {release.deprecatedAt.toISOString().slice(0, 10)}: {release.deprecationReason}
          {view.successorVersion ? (
            <>
              {" "}Successor: <Link href={`/registry/${family.slug}/${view.successorVersion}`} className="underline">{view.successorVersion}</Link>.
            </>
          ) : null}
        </FormMessage>
      ) : null}
      <div className="space-y-8">
        {model.ok ? (
          <div className="grid gap-6 lg:grid-cols-[1fr_18rem]">
            <BandPlot
              title={`Bands of ${family.title} ${release.version} along the default path`}
              distance={model.view.path.distance}
              ticks={model.view.path.ticks}
              series={[{ role: "proposal", label: `release ${release.version}`, energies: model.view.path.energies }]}
              fermiLevel={model.view.fermiLevel}
            />
            <ModelFacts view={model.view} />
          </div>
        ) : (
          <FormMessage kind="error">This release&apos;s document does not validate with the current engine: {model.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}</FormMessage>
        )}
        <SafetyNote validity={model.ok ? model.view.validity : undefined} />
        <div className="grid gap-8 lg:grid-cols-2">
          <Block title="Changelog">
            <Markdown html={htmlOf(release.changelog)} />
          </Block>
          <div className="space-y-8">
            <Block title="Downloads">
              <ul className="space-y-1 text-sm">
                {DOWNLOADS.map((d) => (
                  <li key={d.file}>
                    <a href={`${view.pagePath}/files/${d.file}`} className="text-copper-deep underline" download>
                      {d.label}
                    </a>
                  </li>
                ))}
              </ul>
            </Block>
            <Block title="Pull it from a simulation code">
              <p className="mb-2 text-sm text-ink-soft">
                With an API token from <Link href="/settings/tokens" className="underline">Settings → API tokens</Link> in <code>BANDGATE_TOKEN</code>; the printed sha256 must equal the one above.
              </p>
              <pre className="num overflow-x-auto rounded-md bg-paper-deep p-3 text-xs" data-testid="pull-command">
                {pullCommand(view.appUrl, family.slug, release.version)}
              </pre>
            </Block>
            <Block title="How to cite">
              <p className="num rounded-md bg-paper-deep p-3 text-xs" data-testid="citation">{view.citation}</p>
            </Block>
          </div>
        </div>
        {view.mayCurate ? <CurationForms familySlug={family.slug} version={release.version} deprecated={Boolean(release.deprecatedAt)} withdrawn={Boolean(release.withdrawnAt)} newerVersions={view.newerVersions} /> : null}
      </div>
    </>
  );
}
