import type { listWebhooksWithLog } from "@/lib/registry/subscription-service";
import { RemoveWebhookButton } from "./remove-webhook-button";

type Hook = Awaited<ReturnType<typeof listWebhooksWithLog>>[number];

const STATUS = { pending: "◌ pending", delivered: "✓ delivered", failed: "✕ failed" } as const;

/** One webhook and its recent deliveries, each with every attempt's answer. */
export function DeliveryLog({ hook }: { hook: Hook }) {
  return (
    <article className="rounded-lg border border-rule bg-white/60 p-4" aria-label={`Webhook ${hook.url}`}>
      <header className="flex flex-wrap items-baseline gap-3">
        <span className="num break-all font-semibold">{hook.url}</span>
        <span className="text-sm text-ink-soft">{hook.familyTitle}</span>
        {hook.active ? <RemoveWebhookButton subscriptionId={hook.id} /> : <span className="text-sm">⊘ removed</span>}
      </header>
      <table className="mt-3 w-full text-sm">
        <caption className="sr-only">Deliveries</caption>
        <thead className="text-left text-ink-soft">
          <tr>
            <th className="pr-3 font-semibold">Event</th>
            <th className="pr-3 font-semibold">Release</th>
            <th className="pr-3 font-semibold">State</th>
            <th className="font-semibold">Attempts</th>
          </tr>
        </thead>
        <tbody>
          {hook.deliveries.map((d) => (
            <tr key={d.id} className="border-t border-rule/60 align-top" data-testid="delivery-row">
              <td className="num pr-3">{d.event}</td>
              <td className="num pr-3">{d.version}</td>
              <td className="pr-3">{STATUS[d.status]}</td>
              <td className="num text-xs">
                {d.attemptLog.map((a) => (
                  <div key={a.attempt}>
                    #{a.attempt} {a.createdAt.toISOString().slice(11, 19)} UTC · {a.statusCode ?? "no answer"}
                    {a.error ? ` · ${a.error}` : ""} · {a.durationMs} ms
                  </div>
                ))}
              </td>
            </tr>
          ))}
          {hook.deliveries.length === 0 ? (
            <tr>
              <td colSpan={4} className="text-ink-soft">
                Nothing delivered yet.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </article>
  );
}
