"use client";

import Link from "next/link";
import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { resetPasswordAction } from "../actions";

export function ResetForm({ token }: { token: string }) {
  return (
    <ActionForm
      action={resetPasswordAction}
      label="Choose a new password"
      done={() => (
        <div role="status">
          <p className="mb-4">Your password was changed.</p>
          <Link href="/login" className={primaryButtonClass}>
            Sign in
          </Link>
        </div>
      )}
    >
      {({ fieldErrors, pending }) => (
        <>
          <input type="hidden" name="token" value={token} />
          <Field label="New password" name="password" errors={fieldErrors.password ?? fieldErrors.token} hint="At least 10 characters.">
            <input id="password" name="password" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <Field label="Repeat the password" name="confirm" errors={fieldErrors.confirm}>
            <input id="confirm" name="confirm" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Saving…" : "Change password"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
