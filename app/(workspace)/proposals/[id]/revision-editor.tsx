"use client";

import { ActionForm } from "@/app/_components/action-form";
import { inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { ModelEditor } from "@/app/_components/model-editor/model-editor";
import { saveRevisionAction } from "../actions";

/** The author's editor: every save is a new numbered revision; earlier ones stay readable. */
export function RevisionEditor({ proposalId, version, document, baseDocument, basisLimit }: { proposalId: string; version: number; document: unknown; baseDocument: unknown | null; basisLimit: number }) {
  return (
    <ActionForm action={saveRevisionAction} label="Edit parameters">
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <input type="hidden" name="version" value={version} />
          <ModelEditor initialDocument={document} baseDocument={baseDocument} inputName="document" basisLimit={basisLimit} />
          <div className="sticky bottom-0 mt-4 flex flex-wrap items-end gap-3 border-t border-rule bg-paper/95 py-3">
            <label className="flex-1 text-sm">
              <span className="mb-1 block font-semibold">What changed in this revision</span>
              <input name="note" className={inputClass} placeholder="e.g. refit sp_sigma to the new reference" />
            </label>
            <button type="submit" disabled={pending} className={primaryButtonClass}>
              {pending ? "Saving…" : "Save revision"}
            </button>
          </div>
          {fieldErrors.document ? <p className="text-sm text-danger">{fieldErrors.document.join(" ")}</p> : null}
        </>
      )}
    </ActionForm>
  );
}
