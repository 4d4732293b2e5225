/**
 * One error vocabulary for the whole app: "<kind>:<subject>" codes, mapped to HTTP statuses by kind.
 * Only the message of an AppError reaches a user; anything else is logged and shown as a generic failure.
 */
export type ErrorKind = "unauthenticated" | "forbidden" | "invalid" | "not-found" | "conflict" | "refused" | "rate-limited" | "gone" | "unsupported" | "too-large" | "unavailable";

export type ErrorCode = `${ErrorKind}:${string}`;

const STATUS: Record<ErrorKind, number> = {
  unauthenticated: 401,
  forbidden: 403,
  invalid: 400,
  "not-found": 404,
  conflict: 409,
  refused: 422,
  "rate-limited": 429,
  gone: 410,
  unsupported: 415,
  "too-large": 413,
  unavailable: 503,
};

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fieldErrors?: Record<string, string[]>;
  /** Extra data a client may use, e.g. the current state after a conflict or every reason of a refusal. */
  readonly details?: Record<string, unknown>;

  constructor(code: ErrorCode, message: string, fieldErrors?: Record<string, string[]>, details?: Record<string, unknown>) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.fieldErrors = fieldErrors;
    this.details = details;
  }

  get kind(): ErrorKind {
    return this.code.split(":")[0] as ErrorKind;
  }
}

export function httpStatusOf(code: ErrorCode): number {
  return STATUS[code.split(":")[0] as ErrorKind] ?? 500;
}

export interface ErrorBody {
  error: { code: ErrorCode | "internal:error"; message: string; fieldErrors?: Record<string, string[]>; details?: Record<string, unknown> };
}

/** The JSON body and status a route handler returns for any thrown value. */
export function toErrorResponse(err: unknown): { body: ErrorBody; status: number } {
  if (err instanceof AppError) {
    return {
      body: { error: { code: err.code, message: err.message, fieldErrors: err.fieldErrors, details: err.details } },
      status: httpStatusOf(err.code),
    };
  }
  console.error("[bandgate] unexpected error", err);
  return { body: { error: { code: "internal:error", message: "Something went wrong on our side." } }, status: 500 };
}

/** zod issues as field → messages (the form and API error shape). */
export function fieldErrorsOf(error: { issues: readonly { path: readonly PropertyKey[]; message: string }[] }): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}
