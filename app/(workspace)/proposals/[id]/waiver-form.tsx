"use client";

import { ActionForm } from "@/app/_components/action-form";
import { inputClass } from "@/app/_components/form-parts";
import { waiveChecksAction } from "../actions";

export function WaiverForm({ proposalId, version }: { proposalId: string; version: number }) {
  return (
    <ActionForm action={waiveChecksAction} label="Waive failing checks" className="mt-3 rounded-lg border border-dashed border-copper/60 p-3">
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <input type="hidden" name="version" value={version} />
          <label className="block text-sm">
            <span className="mb-1 block font-semibold">Waive the failing checks (curator; audited)</span>
            <textarea name="reason" rows={2} className={inputClass} placeholder="Why these failures do not matter for this model" />
          </label>
          {fieldErrors.reason ? <p className="text-sm text-danger">{fieldErrors.reason.join(" ")}</p> : null}
          <button type="submit" disabled={pending} className="mt-2 rounded-md border border-copper px-3 py-1 text-sm font-semibold text-copper-deep">
            Waive with this reason
          </button>
        </>
      )}
    </ActionForm>
  );
}
