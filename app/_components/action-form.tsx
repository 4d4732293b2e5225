"use client";

import { useActionState } from "react";
import type { ActionResult } from "@/lib/action";
import { FormMessage } from "./form-parts";

type Action<T> = (prev: ActionResult<T> | null, form: FormData) => Promise<ActionResult<T>>;

/**
 * A form bound to a server action through useActionState. Children receive the field errors of the last attempt;
 * a success replaces the form with `done` when given.
 */
export function ActionForm<T>({
  action,
  children,
  done,
  className,
  label,
}: {
  action: Action<T>;
  children: (state: { fieldErrors: Record<string, string[]>; pending: boolean }) => React.ReactNode;
  done?: (data: T) => React.ReactNode;
  className?: string;
  label?: string;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  if (state?.ok && done) return <>{done(state.data)}</>;
  return (
    <form action={formAction} className={className} noValidate aria-label={label}>
      {state && !state.ok ? <FormMessage kind="error">{state.error}</FormMessage> : null}
      {state?.ok && state.message ? <FormMessage kind="ok">{state.message}</FormMessage> : null}
      {children({ fieldErrors: state && !state.ok ? (state.fieldErrors ?? {}) : {}, pending })}
    </form>
  );
}
