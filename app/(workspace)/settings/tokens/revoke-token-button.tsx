"use client";

import { ActionForm } from "@/app/_components/action-form";
import { revokeTokenAction } from "../actions";

export function RevokeTokenButton({ tokenId, name }: { tokenId: string; name: string }) {
  return (
    <ActionForm action={revokeTokenAction} label={`Revoke ${name}`}>
      {({ pending }) => (
        <>
          <input type="hidden" name="tokenId" value={tokenId} />
          <button type="submit" disabled={pending} className="rounded-md border border-copper px-2 py-0.5 text-xs font-semibold text-copper-deep" aria-label={`Revoke token ${name}`}>
            ● active · revoke
          </button>
        </>
      )}
    </ActionForm>
  );
}
