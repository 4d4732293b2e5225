"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { addWebhookAction } from "../actions";

export function AddWebhookForm({ families }: { families: { slug: string; title: string }[] }) {
  return (
    <ActionForm action={addWebhookAction} label="New webhook" className="max-w-xl">
      {({ pending, fieldErrors }) => (
        <>
          <Field label="Family" name="familySlug" errors={fieldErrors.familySlug}>
            <select id="familySlug" name="familySlug" className={inputClass}>
              {families.map((f) => (
                <option key={f.slug} value={f.slug}>
                  {f.title}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Address (URL)" name="url" errors={fieldErrors.url} hint="Receives a JSON POST on every release, deprecation and withdrawal.">
            <input id="url" name="url" type="url" className={inputClass} placeholder="https://ci.example.org/bandgate-hook" />
          </Field>
          <Field label="Secret" name="secret" errors={fieldErrors.secret} hint="At least 16 characters; each body is signed with HMAC-SHA256 under it.">
            <input id="secret" name="secret" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            Add webhook
          </button>
        </>
      )}
    </ActionForm>
  );
}
