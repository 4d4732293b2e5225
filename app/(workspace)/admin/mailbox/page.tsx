import type { Metadata } from "next";
import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { listCaughtMail } from "@/lib/accounts/queries";
import { requirePageUser } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Mail catcher" };
export const dynamic = "force-dynamic";

export default async function MailboxPage() {
  await requirePageUser("/admin/mailbox", ["admin"]);
  const messages = await listCaughtMail(200);
  return (
    <>
      <PageTitle
        title="Mail catcher"
        lead="In development and tests Bandgate sends mail to a local SMTP listener instead of the outside world. Every message it caught is here."
      />
      <ul className="divide-y divide-rule rounded-lg border border-rule bg-card">
        {messages.map((m) => (
          <li key={m.id}>
            <Link href={`/admin/mailbox/${m.id}`} className="grid gap-1 px-4 py-3 hover:bg-paper-deep md:grid-cols-[12rem_1fr_14rem]">
              <span className="num text-sm">{m.recipients.join(", ")}</span>
              <span className="font-semibold">{m.subject}</span>
              <span className="num text-xs text-ink-soft">{m.receivedAt.toISOString().replace("T", " ").slice(0, 19)} UTC</span>
            </Link>
          </li>
        ))}
        {messages.length === 0 ? <li className="px-4 py-3 text-ink-soft">No messages caught yet.</li> : null}
      </ul>
    </>
  );
}
