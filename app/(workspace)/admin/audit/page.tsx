import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { listAuditEvents } from "@/lib/accounts/queries";
import { requirePageUser } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Audit trail" };
export const dynamic = "force-dynamic";

function summary(value: Record<string, unknown> | null): string {
  return value ? JSON.stringify(value) : "—";
}

export default async function AuditPage() {
  await requirePageUser("/admin/audit", ["admin", "curator"]);
  const events = await listAuditEvents(300);
  return (
    <>
      <PageTitle title="Audit trail" lead="Append-only: every account, role and workflow change, newest first. Entries are never edited or removed." />
      <div className="overflow-x-auto rounded-lg border border-rule bg-card">
        <table className="w-full text-sm">
          <thead className="bg-paper-deep text-left">
            <tr>
              <th className="px-3 py-2">When (UTC)</th>
              <th className="px-3 py-2">Who</th>
              <th className="px-3 py-2">What</th>
              <th className="px-3 py-2">Subject</th>
              <th className="px-3 py-2">Before</th>
              <th className="px-3 py-2">After</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-rule">
            {events.map((e) => (
              <tr key={e.id}>
                <td className="num whitespace-nowrap px-3 py-2">{e.createdAt.toISOString().replace("T", " ").slice(0, 19)}</td>
                <td className="px-3 py-2">{e.actorName ?? "system"}</td>
                <td className="num px-3 py-2">{e.action}</td>
                <td className="num px-3 py-2 text-xs">
                  {e.subjectType} {e.subjectId?.slice(0, 8)}
                </td>
                <td className="num px-3 py-2 text-xs">{summary(e.before)}</td>
                <td className="num px-3 py-2 text-xs">{summary(e.after)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
