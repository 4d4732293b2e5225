import type { Metadata } from "next";
import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { listFamilies } from "@/lib/families/queries";

export const metadata: Metadata = { title: "Model families" };
export const dynamic = "force-dynamic";

export default async function FamiliesPage() {
  const user = await requirePageUser("/families");
  const families = await listFamilies();
  return (
    <>
      <div className="flex items-start justify-between gap-4">
        <PageTitle title="Model families" lead="One line of models per material; each family collects its proposals and releases." />
        {user.roles.includes("curator") ? (
          <Link href="/families/new" className="shrink-0 rounded-md border border-copper px-4 py-2 font-semibold text-copper-deep hover:bg-copper-pale">
            Open a family
          </Link>
        ) : null}
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        {families.map((f) => (
          <Link key={f.id} href={`/families/${f.slug}`} className="rounded-xl border border-rule bg-card p-4 hover:border-copper">
            <div className="num mb-1 text-xs text-ink-soft">
              {f.dimension}D · {f.slug}
            </div>
            <div className="font-semibold">{f.title}</div>
            <p className="mt-2 text-sm text-ink-soft">{f.description}</p>
            {f.isDemo ? <div className="mt-3 inline-block rounded bg-paper-deep px-2 py-0.5 text-xs">demo data, invented values</div> : null}
          </Link>
        ))}
      </div>
    </>
  );
}
