"use client";

import Link from "next/link";
import type { ActionResult } from "@/lib/action";
import { ActionForm } from "./action-form";
import { NewPasswordFields, primaryButtonClass } from "./form-parts";

/** A one-time link's form: choose a password twice, then a way to sign in (joining and password reset). */
export function TokenPasswordForm<T>({
  action,
  token,
  label,
  submitLabel,
  doneText,
}: {
  action: (prev: ActionResult<T> | null, form: FormData) => Promise<ActionResult<T>>;
  token: string;
  label: string;
  submitLabel: string;
  doneText: (data: T) => string;
}) {
  return (
    <ActionForm
      action={action}
      label={label}
      done={(data) => (
        <div role="status">
          <p className="mb-4">{doneText(data)}</p>
          <Link href="/login" className={primaryButtonClass}>
            Sign in
          </Link>
        </div>
      )}
    >
      {({ fieldErrors, pending }) => (
        <>
          <input type="hidden" name="token" value={token} />
          <NewPasswordFields fieldErrors={fieldErrors} />
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Saving…" : submitLabel}
          </button>
        </>
      )}
    </ActionForm>
  );
}
