"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { changePasswordAction } from "./actions";

export function PasswordForm() {
  return (
    <ActionForm action={changePasswordAction} label="Change password" className="max-w-md rounded-xl border border-rule bg-card p-5">
      {({ fieldErrors, pending }) => (
        <>
          <h2 className="mb-3 text-lg font-semibold">Change password</h2>
          <Field label="Current password" name="current" errors={fieldErrors.current}>
            <input id="current" name="current" type="password" autoComplete="current-password" className={inputClass} />
          </Field>
          <Field label="New password" name="password" errors={fieldErrors.password} hint="At least 10 characters.">
            <input id="password" name="password" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <Field label="Repeat the new password" name="confirm" errors={fieldErrors.confirm}>
            <input id="confirm" name="confirm" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            Change password
          </button>
        </>
      )}
    </ActionForm>
  );
}
