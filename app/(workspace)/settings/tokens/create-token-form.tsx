"use client";

import { ActionForm } from "@/app/_components/action-form";
import { Field, inputClass, primaryButtonClass } from "@/app/_components/form-parts";
import { createTokenAction } from "../actions";

/** Creates a token and shows it this once; afterwards only its first characters are known. */
export function CreateTokenForm() {
  return (
    <ActionForm
      action={createTokenAction}
      label="New API token"
      className="max-w-xl"
      done={(data) => (
        <div role="status" className="max-w-3xl rounded-lg border border-copper/60 bg-copper-pale/40 p-4">
          <p className="font-semibold">Token “{data.name}” created. Copy it now: it is not shown again.</p>
          <pre className="num mt-2 overflow-x-auto rounded bg-white p-2 text-sm" data-testid="new-token">
            {data.token}
          </pre>
          <p className="mt-2 text-sm text-ink-soft">Use it as <code>Authorization: Bearer &lt;token&gt;</code>, e.g. <code>export BANDGATE_TOKEN=…</code> for the pull command on a release page.</p>
        </div>
      )}
    >
      {({ pending, fieldErrors }) => (
        <>
          <Field label="Token name" name="name" errors={fieldErrors.name} hint="Say where it is used, e.g. “transport CI”.">
            <input id="name" name="name" className={inputClass} autoComplete="off" />
          </Field>
          <button type="submit" disabled={pending} className={primaryButtonClass}>
            Create read-only token
          </button>
        </>
      )}
    </ActionForm>
  );
}
