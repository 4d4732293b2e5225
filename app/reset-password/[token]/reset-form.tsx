"use client";

import { TokenPasswordForm } from "@/app/_components/token-password-form";
import { resetPasswordAction } from "../actions";

export function ResetForm({ token }: { token: string }) {
  return (
    <TokenPasswordForm
      action={resetPasswordAction}
      token={token}
      label="Choose a new password"
      submitLabel="Change password"
      doneText={() => "Your password was changed."}
    />
  );
}
