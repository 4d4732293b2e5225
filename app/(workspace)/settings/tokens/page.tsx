import type { Metadata } from "next";
import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { listApiTokens } from "@/lib/registry/token-service";
import { API_TOKEN_LIMIT } from "@/lib/registry/tokens";
import { CreateTokenForm } from "./create-token-form";
import { RevokeTokenButton } from "./revoke-token-button";

export const metadata: Metadata = { title: "API tokens" };
export const dynamic = "force-dynamic";

const when = (d: Date | null) => (d ? `${d.toISOString().slice(0, 16).replace("T", " ")} UTC` : "never");

export default async function TokensPage() {
  const user = await requirePageUser("/settings/tokens");
  const tokens = await listApiTokens(user.id);
  return (
    <>
      <PageTitle
        title="API tokens"
        lead={
          <>
            Read-only tokens for pulling releases over the registry API (<a href="/api/v1/openapi.json" className="underline">OpenAPI description</a>). A
            token is shown once, stored only as a hash, and can be revoked at any time; you may hold {API_TOKEN_LIMIT} active tokens at
            once ({tokens.filter((t) => !t.revokedAt).length} now). Webhooks and e-mail are under{" "}
            <Link href="/settings/notifications" className="underline">Notifications</Link>.
          </>
        }
      />
      <CreateTokenForm />
      <table className="mt-8 w-full text-sm">
        <caption className="sr-only">Your API tokens</caption>
        <thead className="border-b border-rule text-left text-ink-soft">
          <tr>
            <th className="py-2 pr-4 font-semibold">Name</th>
            <th className="py-2 pr-4 font-semibold">Starts with</th>
            <th className="py-2 pr-4 font-semibold">Scope</th>
            <th className="py-2 pr-4 font-semibold">Limit</th>
            <th className="py-2 pr-4 font-semibold">Created</th>
            <th className="py-2 pr-4 font-semibold">Last used</th>
            <th className="py-2 font-semibold">State</th>
          </tr>
        </thead>
        <tbody>
          {tokens.map((t) => (
            <tr key={t.id} className="border-b border-rule/60" data-testid="token-row">
              <td className="py-2 pr-4 font-semibold">{t.name}</td>
              <td className="num py-2 pr-4">{t.prefix}…</td>
              <td className="py-2 pr-4">{t.scope === "read" ? "read-only" : t.scope}</td>
              <td className="num py-2 pr-4">{t.requestsPerMinute}/min</td>
              <td className="num py-2 pr-4">{when(t.createdAt)}</td>
              <td className="num py-2 pr-4">{when(t.lastUsedAt)}</td>
              <td className="py-2">{t.revokedAt ? <span>⊘ revoked {when(t.revokedAt)}</span> : <RevokeTokenButton tokenId={t.id} name={t.name} />}</td>
            </tr>
          ))}
          {tokens.length === 0 ? (
            <tr>
              <td colSpan={7} className="py-3 text-ink-soft">
                No tokens yet.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </>
  );
}
