"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { releaseProposalAction } from "../../../actions";

/** Version (suggested, may only be raised) and changelog (drafted from the keyed diff and the rationale). */
export function ReleaseForm({ proposalId, version, suggested, changelog }: { proposalId: string; version: number; suggested: string; changelog: string }) {
  return (
    <ActionForm action={releaseProposalAction} label="Release" className="max-w-3xl">
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <input type="hidden" name="version" value={version} />
          <Field label="Version" name="releaseVersion" errors={fieldErrors.releaseVersion} hint={`Suggested ${suggested}; you may raise it, not lower it.`}>
            <input id="releaseVersion" name="releaseVersion" defaultValue={suggested} className={`${inputClass} num max-w-xs`} autoComplete="off" />
          </Field>
          <Field label="Changelog" name="changelog" errors={fieldErrors.changelog} hint="Markdown. Drafted from the parameter diff and the rationale; edit freely before releasing.">
            <textarea id="changelog" name="changelog" defaultValue={changelog} rows={14} className={`${inputClass} num text-sm`} />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Releasing…" : "Release"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
