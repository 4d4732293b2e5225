"use client";

import { TokenPasswordForm } from "@/app/_components/token-password-form";
import { acceptInvitationAction } from "../actions";

export function JoinForm({ token }: { token: string }) {
  return (
    <TokenPasswordForm
      action={acceptInvitationAction}
      token={token}
      label="Set your password"
      submitLabel="Set password and join"
      doneText={({ email }) => `Your account ${email} is ready.`}
    />
  );
}
