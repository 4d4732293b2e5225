"use client";

import { ActionForm } from "@/app/_components/action-form";
import { inputClass } from "@/app/_components/form-parts";
import { deprecateReleaseAction, withdrawReleaseAction } from "../../actions";

const buttonClass = "mt-2 rounded-md border border-copper px-3 py-1 text-sm font-semibold text-copper-deep";

/** Deprecate or withdraw (curators of the family): recorded once, never edited; the release stays readable. */
export function CurationForms({ familySlug, version, deprecated, withdrawn, newerVersions }: { familySlug: string; version: string; deprecated: boolean; withdrawn: boolean; newerVersions: string[] }) {
  return (
    <section aria-label="Curation" className="grid gap-6 rounded-lg border border-dashed border-copper/60 p-4 lg:grid-cols-2">
      {!deprecated ? (
        <ActionForm action={deprecateReleaseAction} label="Deprecate this release">
          {({ pending, fieldErrors }) => (
            <>
              <input type="hidden" name="familySlug" value={familySlug} />
              <input type="hidden" name="releaseVersion" value={version} />
              <h2 className="mb-2 font-semibold">Deprecate {version}</h2>
              <label className="block text-sm">
                <span className="mb-1 block">Reason</span>
                <textarea name="reason" rows={2} className={inputClass} />
              </label>
              {fieldErrors.reason ? <p className="text-sm text-danger">{fieldErrors.reason.join(" ")}</p> : null}
              <label className="mt-2 block text-sm">
                <span className="mb-1 block">Successor</span>
                <select name="successorVersion" className={inputClass} defaultValue={newerVersions[0] ?? ""}>
                  <option value="">none</option>
                  {newerVersions.map((v) => (
                    <option key={v} value={v}>
                      {v}
                    </option>
                  ))}
                </select>
              </label>
              {fieldErrors.successorVersion ? <p className="text-sm text-danger">{fieldErrors.successorVersion.join(" ")}</p> : null}
              <button type="submit" disabled={pending} className={buttonClass}>
                Deprecate
              </button>
            </>
          )}
        </ActionForm>
      ) : null}
      {!withdrawn ? (
        <ActionForm action={withdrawReleaseAction} label="Withdraw this release">
          {({ pending, fieldErrors }) => (
            <>
              <input type="hidden" name="familySlug" value={familySlug} />
              <input type="hidden" name="releaseVersion" value={version} />
              <h2 className="mb-2 font-semibold">Withdraw {version}</h2>
              <label className="block text-sm">
                <span className="mb-1 block">Reason (it stays readable, flagged)</span>
                <textarea name="reason" rows={2} className={inputClass} />
              </label>
              {fieldErrors.reason ? <p className="text-sm text-danger">{fieldErrors.reason.join(" ")}</p> : null}
              <button type="submit" disabled={pending} className={buttonClass}>
                Withdraw
              </button>
            </>
          )}
        </ActionForm>
      ) : null}
    </section>
  );
}
