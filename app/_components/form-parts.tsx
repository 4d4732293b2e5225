export const inputClass =
  "w-full rounded-md border border-rule bg-white px-3 py-2 text-ink placeholder:text-ink-soft/60 focus:border-copper focus:outline-none";

export const primaryButtonClass =
  "rounded-md bg-copper px-4 py-2 font-semibold text-white hover:bg-copper-deep disabled:cursor-not-allowed disabled:opacity-60";

export function Field({ label, name, errors, children, hint }: { label: string; name: string; errors?: string[]; children: React.ReactNode; hint?: string }) {
  const errorId = `${name}-error`;
  return (
    <div className="mb-4">
      <label htmlFor={name} className="mb-1 block text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint ? <p className="mt-1 text-xs text-ink-soft">{hint}</p> : null}
      {errors?.length ? (
        <p id={errorId} className="mt-1 text-sm text-danger" role="alert">
          {errors.join(" ")}
        </p>
      ) : null}
    </div>
  );
}

export function FormMessage({ kind, children }: { kind: "error" | "ok"; children: React.ReactNode }) {
  return (
    <div
      role={kind === "error" ? "alert" : "status"}
      className={`mb-4 rounded-md px-3 py-2 text-sm ${kind === "error" ? "bg-danger-pale text-danger" : "bg-ok-pale text-ok"}`}
    >
      {children}
    </div>
  );
}

/** New password twice, as used when joining, resetting and changing a password. */
export function NewPasswordFields({ fieldErrors, label = "New password", repeatLabel = "Repeat the password" }: { fieldErrors: Record<string, string[]>; label?: string; repeatLabel?: string }) {
  return (
    <>
      <Field label={label} name="password" errors={fieldErrors.password ?? fieldErrors.token} hint="At least 10 characters.">
        <input id="password" name="password" type="password" autoComplete="new-password" className={inputClass} />
      </Field>
      <Field label={repeatLabel} name="confirm" errors={fieldErrors.confirm}>
        <input id="confirm" name="confirm" type="password" autoComplete="new-password" className={inputClass} />
      </Field>
    </>
  );
}
