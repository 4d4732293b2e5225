"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, NewPasswordFields, primaryButtonClass } from "@/app/_components/form-parts";
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
          <NewPasswordFields fieldErrors={fieldErrors} repeatLabel="Repeat the new password" />
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            Change password
          </button>
        </>
      )}
    </ActionForm>
  );
}
