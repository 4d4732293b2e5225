import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageTitle } from "@/app/_components/page-title";
import { getCaughtMail } from "@/lib/accounts/queries";
import { requirePageUser } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Caught message" };
export const dynamic = "force-dynamic";

/** Links in the text body become clickable; nothing else of the message is interpreted. */
function linkify(text: string): React.ReactNode[] {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all text-copper-deep underline">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

export default async function CaughtMessagePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageUser(`/admin/mailbox/${id}`, ["admin"]);
  const numericId = Number(id);
  const message = Number.isSafeInteger(numericId) && numericId > 0 ? await getCaughtMail(numericId) : null;
  if (!message) notFound();
  return (
    <>
      <Link href="/admin/mailbox" className="text-sm text-copper-deep underline">
        ← All caught mail
      </Link>
      <div className="mt-3">
        <PageTitle title={message.subject} />
      </div>
      <dl className="mb-4 grid grid-cols-[6rem_1fr] gap-1 text-sm">
        <dt className="text-ink-soft">From</dt>
        <dd className="num">{message.sender}</dd>
        <dt className="text-ink-soft">To</dt>
        <dd className="num">{message.recipients.join(", ")}</dd>
        <dt className="text-ink-soft">Received</dt>
        <dd className="num">{message.receivedAt.toISOString()}</dd>
      </dl>
      <pre className="whitespace-pre-wrap rounded-lg border border-rule bg-card p-4 font-sans" data-testid="mail-body">
        {linkify(message.textBody)}
      </pre>
    </>
  );
}
