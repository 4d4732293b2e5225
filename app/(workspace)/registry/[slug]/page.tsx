import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageTitle } from "@/app/_components/page-title";
import { db } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { getFamilyIdentity, listReleasesOfFamily } from "@/lib/registry/queries";
import { releaseStatus } from "@/lib/registry/status";
import { listFollowedFamilyIds } from "@/lib/registry/subscription-service";
import { FollowForm } from "./follow-form";
import { StatusBadge } from "../status-badge";

export const metadata: Metadata = { title: "Registry family" };
export const dynamic = "force-dynamic";

export default async function RegistryFamilyPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const user = await requirePageUser(`/registry/${slug}`);
  const family = await getFamilyIdentity(db, slug);
  if (!family) notFound();
  const releases = await listReleasesOfFamily(db, family.id);
  const following = (await listFollowedFamilyIds(user.id)).has(family.id);
  return (
    <>
      <Link href="/registry" className="text-sm text-copper-deep underline">
        ← Registry
      </Link>
      <PageTitle title={family.title} lead={family.description} />
      <div className="mb-6 flex flex-wrap items-center gap-4 text-sm">
        <FollowForm familySlug={family.slug} following={following} />
        <Link href={`/families/${family.slug}`} className="text-copper-deep underline">
          Family page and proposals
        </Link>
      </div>
      <ol className="space-y-4">
        {releases.map((r) => (
          <li key={r.id} className="rounded-lg border border-rule bg-white/60 p-4">
            <div className="flex flex-wrap items-baseline gap-3">
              <Link href={`/registry/${family.slug}/${r.version}`} className="num text-lg font-semibold text-copper-deep underline">
                {r.version}
              </Link>
              <StatusBadge status={releaseStatus(r)} />
              <span className="num text-xs text-ink-soft">
                {r.createdAt.toISOString().slice(0, 10)} · sha256 {r.sha256.slice(0, 16)}…
              </span>
            </div>
            <p className="mt-2 line-clamp-2 text-sm text-ink-soft">{r.changelog.split("\n")[0]}</p>
          </li>
        ))}
        {releases.length === 0 ? <li className="text-ink-soft">No releases yet.</li> : null}
      </ol>
    </>
  );
}
