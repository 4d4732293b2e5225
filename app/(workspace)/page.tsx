import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { SafetyNote } from "@/app/_components/safety-note";
import { requirePageUser } from "@/lib/auth/guard";
import { ROLE_DESCRIPTIONS } from "@/lib/auth/roles";
import { listFamilies } from "@/lib/families/queries";

export const dynamic = "force-dynamic";

export default async function OverviewPage() {
  const user = await requirePageUser("/");
  const families = await listFamilies();
  return (
    <>
      <PageTitle
        title={`Good to see you, ${user.name.split(" ")[0]}`}
        lead="Bandgate keeps your group's tight-binding models: proposals are reviewed on their parameters and their bands, and only accepted versions are released."
      />
      <section aria-labelledby="roles-heading" className="mb-8">
        <h2 id="roles-heading" className="mb-2 text-sm font-semibold uppercase tracking-wider text-ink-soft">
          Your roles
        </h2>
        <ul className="grid gap-2 sm:grid-cols-2">
          {user.roles.map((role) => (
            <li key={role} className="rounded-lg border border-rule bg-card px-4 py-3">
              <div className="font-semibold capitalize">{role}</div>
              <div className="text-sm text-ink-soft">{ROLE_DESCRIPTIONS[role]}</div>
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="families-heading" className="mb-8">
        <h2 id="families-heading" className="mb-2 text-sm font-semibold uppercase tracking-wider text-ink-soft">
          Model families
        </h2>
        <ul className="divide-y divide-rule rounded-lg border border-rule bg-card">
          {families.map((f) => (
            <li key={f.id} className="flex items-baseline gap-4 px-4 py-3">
              <span className="num w-10 text-sm text-ink-soft">{f.dimension}D</span>
              <Link href={`/families/${f.slug}`} className="font-semibold text-ink hover:text-copper-deep">
                {f.title}
              </Link>
              <span className="num text-xs text-ink-soft">{f.slug}</span>
            </li>
          ))}
          {families.length === 0 ? <li className="px-4 py-3 text-ink-soft">No model families yet.</li> : null}
        </ul>
      </section>
      <SafetyNote />
    </>
  );
}
