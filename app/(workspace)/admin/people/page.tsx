import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { listOpenInvitations, listUsers } from "@/lib/accounts/queries";
import { requirePageUser } from "@/lib/auth/guard";
import { InviteForm } from "./invite-form";
import { PersonRow } from "./person-row";

export const metadata: Metadata = { title: "People" };
export const dynamic = "force-dynamic";

export default async function PeoplePage() {
  const me = await requirePageUser("/admin/people", ["admin"]);
  const [people, invitations] = await Promise.all([listUsers(), listOpenInvitations()]);
  return (
    <>
      <PageTitle title="People" lead="Invite colleagues, set what each may do, and close accounts. Every change is written to the audit trail." />
      <div className="mb-8">
        <InviteForm />
      </div>
      {invitations.length > 0 ? (
        <section className="mb-8" aria-labelledby="pending-heading">
          <h2 id="pending-heading" className="mb-2 text-sm font-semibold uppercase tracking-wider text-ink-soft">
            Waiting for a password
          </h2>
          <ul className="divide-y divide-rule rounded-lg border border-rule bg-card">
            {invitations.map((i) => (
              <li key={i.id} className="flex flex-wrap gap-4 px-4 py-2 text-sm">
                <span className="font-semibold">{i.name}</span>
                <span className="num">{i.email}</span>
                <span className="text-ink-soft">{i.roles.join(", ")}</span>
                <span className="text-ink-soft">until {i.expiresAt.toISOString().slice(0, 10)}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="people-heading">
        <h2 id="people-heading" className="mb-2 text-sm font-semibold uppercase tracking-wider text-ink-soft">
          Accounts
        </h2>
        <ul className="divide-y divide-rule rounded-lg border border-rule bg-card">
          {people.map((p) => (
            <PersonRow key={`${p.id}-${p.version}`} person={p} isSelf={p.id === me.id} />
          ))}
        </ul>
      </section>
    </>
  );
}
