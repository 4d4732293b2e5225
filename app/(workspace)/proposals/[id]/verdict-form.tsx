"use client";

import { ActionForm } from "@/app/_components/action-form";
import { inputClass } from "@/app/_components/form-parts";
import { VERDICT_LABEL, VERDICTS } from "@/board/stages";
import { verdictAction } from "../actions";

export function VerdictForm({ proposalId }: { proposalId: string }) {
  return (
    <ActionForm action={verdictAction} label="Give a verdict" className="rounded-lg border border-rule bg-card p-4">
      {({ pending, fieldErrors }) => (
        <>
          <input type="hidden" name="proposalId" value={proposalId} />
          <fieldset className="mb-3">
            <legend className="mb-1 text-sm font-semibold">Your verdict on the latest revision</legend>
            <div className="flex flex-wrap gap-4 text-sm">
              {VERDICTS.map((v) => (
                <label key={v} className="flex items-center gap-1">
                  <input type="radio" name="verdict" value={v} className="accent-copper" /> {VERDICT_LABEL[v]}
                </label>
              ))}
            </div>
            {fieldErrors.verdict ? <p className="text-sm text-danger">{fieldErrors.verdict.join(" ")}</p> : null}
          </fieldset>
          <label className="block text-sm">
            <span className="mb-1 block font-semibold">Summary (markdown, $math$)</span>
            <textarea name="summary" rows={3} className={inputClass} />
          </label>
          {fieldErrors.summary ? <p className="text-sm text-danger">{fieldErrors.summary.join(" ")}</p> : null}
          <button type="submit" disabled={pending} className="mt-2 rounded-md bg-copper px-3 py-1.5 text-sm font-semibold text-white">
            Record verdict
          </button>
        </>
      )}
    </ActionForm>
  );
}
