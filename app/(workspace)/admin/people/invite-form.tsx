"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { ROLES } from "@/lib/auth/roles";
import { inviteAction } from "./actions";

export function InviteForm() {
  return (
    <ActionForm action={inviteAction} label="Invite a person" className="rounded-xl border border-rule bg-card p-5">
      {({ fieldErrors, pending }) => (
        <>
          <h2 className="mb-3 text-lg font-semibold">Invite a person</h2>
          <div className="grid gap-x-4 sm:grid-cols-2">
            <Field label="Name" name="invite-name" errors={fieldErrors.name}>
              <input id="invite-name" name="name" className={inputClass} />
            </Field>
            <Field label="E-mail" name="invite-email" errors={fieldErrors.email}>
              <input id="invite-email" name="email" type="email" className={inputClass} />
            </Field>
          </div>
          <fieldset className="mb-4">
            <legend className="mb-1 text-sm font-semibold">Roles</legend>
            <div className="flex flex-wrap gap-4">
              {ROLES.map((role) => (
                <label key={role} className="flex items-center gap-1.5 text-sm">
                  <input type="checkbox" name="roles" value={role} className="accent-copper" /> {role}
                </label>
              ))}
            </div>
            {fieldErrors.roles ? (
              <p className="mt-1 text-sm text-danger" role="alert">
                {fieldErrors.roles.join(" ")}
              </p>
            ) : null}
          </fieldset>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            {pending ? "Sending…" : "Send invitation"}
          </button>
        </>
      )}
    </ActionForm>
  );
}
