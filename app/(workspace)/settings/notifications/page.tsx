import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { listRegistryFamilies } from "@/lib/registry/queries";
import { listFollowedFamilyIds, listWebhooksWithLog } from "@/lib/registry/subscription-service";
import { listFamilies } from "@/lib/families/queries";
import { FollowForm } from "../../registry/[slug]/follow-form";
import { AddWebhookForm } from "./add-webhook-form";
import { DeliveryLog } from "./delivery-log";

export const metadata: Metadata = { title: "Notifications" };
export const dynamic = "force-dynamic";

export default async function NotificationsPage() {
  const user = await requirePageUser("/settings/notifications");
  const [families, registry, followed, hooks] = await Promise.all([listFamilies(), listRegistryFamilies(), listFollowedFamilyIds(user.id), listWebhooksWithLog(user.id)]);
  return (
    <>
      <PageTitle
        title="Notifications"
        lead="Be told when a family gets a release, a deprecation or a withdrawal: by e-mail, or by a signed JSON POST to your own address (see the README for the Bandgate-Signature header)."
      />
      <section aria-label="E-mail" className="mb-10">
        <h2 className="mb-2 text-lg font-semibold">E-mail</h2>
        <ul className="space-y-2 text-sm">
          {families.map((f) => (
            <li key={f.id} className="flex flex-wrap items-center gap-3">
              <span className="min-w-64 font-semibold">{f.title}</span>
              <FollowForm familySlug={f.slug} following={followed.has(f.id)} />
            </li>
          ))}
        </ul>
      </section>
      <section aria-label="Webhooks">
        <h2 className="mb-2 text-lg font-semibold">Webhooks</h2>
        <AddWebhookForm families={registry.map((f) => ({ slug: f.slug, title: f.title }))} />
        <div className="mt-6 space-y-6">
          {hooks.map((h) => (
            <DeliveryLog key={h.id} hook={h} />
          ))}
          {hooks.length === 0 ? <p className="text-sm text-ink-soft">No webhooks yet.</p> : null}
        </div>
      </section>
    </>
  );
}
