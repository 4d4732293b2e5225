"use client";

import Link from "next/link";
import { ActionForm } from "@/app/_components/action-form";
import { NewPasswordFields, primaryButtonClass } from "@/app/_components/form-parts";
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
          <NewPasswordFields fieldErrors={fieldErrors} />
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Saving…" : "Set password and join"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
