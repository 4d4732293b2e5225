import "server-only";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { AppError, fieldErrorsOf, type ErrorCode } from "./errors";
import { hasNul, NUL_MESSAGE } from "./pg-text";

export { fieldErrorsOf };
import { requireRole, requireUser } from "./auth/guard";
import type { Role } from "./auth/roles";
import type { SessionUser } from "./auth/session-user";

export type ActionResult<T> =
  | { ok: true; data: T; message?: string }
  | { ok: false; code: ErrorCode | "internal:error"; error: string; fieldErrors?: Record<string, string[]> };

type Access = { roles: Role[] } | "signed-in" | "public";

/** FormData → plain object; keys that appear more than once (checkbox groups) become arrays. */
export function formDataToObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of new Set(form.keys())) {
    if (key.startsWith("$ACTION")) continue;
    const all = form.getAll(key).filter((v): v is string => typeof v === "string");
    out[key] = all.length > 1 ? all : all[0];
  }
  return out;
}

/** Form fields (and uploaded files' names) that hold NUL, which PostgreSQL cannot store. */
function nulFieldErrors(form: FormData): Record<string, string[]> | null {
  const out: Record<string, string[]> = {};
  for (const [key, value] of form.entries()) {
    if (key.startsWith("$ACTION")) continue;
    if (hasNul(typeof value === "string" ? value : value.name)) out[key] = [typeof value === "string" ? NUL_MESSAGE : `The file name: ${NUL_MESSAGE}`];
  }
  return Object.keys(out).length > 0 ? out : null;
}

/**
 * Every server action goes through here: session → zod parse → service → discriminated result.
 * Actions are public POST endpoints, so the access check is never optional.
 */
export function defineAction<S extends z.ZodType, T>(options: {
  access: Access;
  schema: S;
  /** The raw form is passed too, for uploads (File entries are not part of the parsed input). */
  run: (input: z.output<S>, user: SessionUser | null, form: FormData) => Promise<T>;
  message?: string;
}) {
  return async (_prev: ActionResult<T> | null, form: FormData): Promise<ActionResult<T>> => {
    try {
      const user =
        options.access === "public" ? null : options.access === "signed-in" ? await requireUser() : await requireRole(...options.access.roles);
      const nul = nulFieldErrors(form);
      if (nul) return { ok: false, code: "invalid:input", error: "Some fields need attention.", fieldErrors: nul };
      const parsed = options.schema.safeParse(formDataToObject(form));
      if (!parsed.success) {
        return { ok: false, code: "invalid:input", error: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error) };
      }
      const data = await options.run(parsed.data, user, form);
      return { ok: true, data, message: options.message };
    } catch (err) {
      unstable_rethrow(err); // redirect() and notFound() are control flow, not failures
      if (err instanceof AppError) return { ok: false, code: err.code, error: err.message, fieldErrors: err.fieldErrors };
      console.error("[bandgate] action failed", err);
      return { ok: false, code: "internal:error", error: "Something went wrong on our side." };
    }
  };
}
