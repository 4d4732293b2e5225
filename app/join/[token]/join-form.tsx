"use client";

import Link from "next/link";
import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { acceptInvitationAction } from "../actions";

export function JoinForm({ token }: { token: string }) {
  return (
    <ActionForm
      action={acceptInvitationAction}
      label="Set your password"
      done={({ email }) => (
        <div role="status">
          <p className="mb-4">Your account {email} is ready.</p>
          <Link href="/login" className={primaryButtonClass}>
            Sign in
          </Link>
        </div>
      )}
    >
      {({ fieldErrors, pending }) => (
        <>
          <input type="hidden" name="token" value={token} />
          <Field label="New password" name="password" errors={fieldErrors.password} hint="At least 10 characters.">
            <input id="password" name="password" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <Field label="Repeat the password" name="confirm" errors={fieldErrors.confirm}>
            <input id="confirm" name="confirm" type="password" autoComplete="new-password" className={inputClass} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Saving…" : "Set password and join"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
