"use client";

import { ActionForm } from "@/app/_components/action-form";
import { removeWebhookAction } from "../actions";

export function RemoveWebhookButton({ subscriptionId }: { subscriptionId: string }) {
  return (
    <ActionForm action={removeWebhookAction} label="Remove webhook">
      {({ pending }) => (
        <>
          <input type="hidden" name="subscriptionId" value={subscriptionId} />
          <button type="submit" disabled={pending} className="rounded-md border border-copper px-2 py-0.5 text-xs font-semibold text-copper-deep">
            Remove
          </button>
        </>
      )}
    </ActionForm>
  );
}
