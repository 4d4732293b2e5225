"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { requestResetAction } from "./actions";

export function RequestResetForm() {
  return (
    <ActionForm
      action={requestResetAction}
      label="Request a password reset"
      done={({ email }) => (
        <p role="status">
          If {email} belongs to an active account, a reset link is on its way. It works once, for one hour.
        </p>
      )}
    >
      {({ fieldErrors, pending }) => (
        <>
          <Field label="E-mail" name="email" errors={fieldErrors.email}>
            <input id="email" name="email" type="email" autoComplete="username" className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Sending…" : "Send reset link"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
