import type { Metadata } from "next";
import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { listRegistryFamilies } from "@/lib/registry/queries";

export const metadata: Metadata = { title: "Registry" };
export const dynamic = "force-dynamic";

export default async function RegistryPage() {
  await requirePageUser("/registry");
  const families = await listRegistryFamilies();
  return (
    <>
      <PageTitle
        title="Registry"
        lead="Released model documents, fixed forever by version and checksum. Simulation codes pull them over the API with a token (Settings → API tokens)."
      />
      <table className="w-full text-sm">
        <caption className="sr-only">Model families and their latest current release</caption>
        <thead className="border-b border-rule text-left text-ink-soft">
          <tr>
            <th className="py-2 pr-4 font-semibold">Family</th>
            <th className="py-2 pr-4 font-semibold">Dimension</th>
            <th className="py-2 pr-4 font-semibold">Latest release</th>
            <th className="py-2 pr-4 font-semibold">sha256</th>
            <th className="py-2 pr-4 font-semibold">Released</th>
            <th className="py-2 font-semibold">Releases</th>
          </tr>
        </thead>
        <tbody>
          {families.map((f) => (
            <tr key={f.slug} className="border-b border-rule/60 align-top">
              <td className="py-2 pr-4">
                <Link href={`/registry/${f.slug}`} className="font-semibold text-copper-deep underline">
                  {f.title}
                </Link>
                <span className="num block text-xs text-ink-soft">{f.slug}</span>
              </td>
              <td className="num py-2 pr-4">{f.dimension}D</td>
              <td className="num py-2 pr-4">
                {f.version ? (
                  <Link href={`/registry/${f.slug}/${f.version}`} className="underline">
                    {f.version}
                  </Link>
                ) : (
                  <span className="text-ink-soft">none current</span>
                )}
              </td>
              <td className="num py-2 pr-4 text-xs">{f.sha256 ? `${f.sha256.slice(0, 16)}…` : "—"}</td>
              <td className="num py-2 pr-4">{f.releasedAt ? f.releasedAt.toISOString().slice(0, 10) : "—"}</td>
              <td className="num py-2">{f.releases}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {families.length === 0 ? <p className="mt-4 text-ink-soft">No model families yet.</p> : null}
    </>
  );
}
