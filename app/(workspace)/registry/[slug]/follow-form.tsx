"use client";

import { ActionForm } from "@/app/_components/action-form";
import { followFamilyAction } from "../actions";

/** Follow a family by e-mail: releases, deprecations and withdrawals. */
export function FollowForm({ familySlug, following }: { familySlug: string; following: boolean }) {
  return (
    <ActionForm action={followFamilyAction} label="Follow by e-mail">
      {({ pending }) => (
        <>
          <input type="hidden" name="familySlug" value={familySlug} />
          <input type="hidden" name="follow" value={following ? "no" : "yes"} />
          <button type="submit" disabled={pending} className="rounded-md border border-copper px-3 py-1 font-semibold text-copper-deep">
            {following ? "Stop e-mails about this family" : "E-mail me about new releases"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
