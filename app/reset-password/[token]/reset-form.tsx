"use client";

import Link from "next/link";
import { ActionForm } from "@/app/_components/action-form";
import { NewPasswordFields, primaryButtonClass } from "@/app/_components/form-parts";
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
          <NewPasswordFields fieldErrors={fieldErrors} />
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Saving…" : "Change password"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
