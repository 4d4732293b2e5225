import type { ErrorBody } from "./errors";

/** An error answer from our API, with its coded error kept intact for the UI. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: Record<string, unknown>,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
    this.name = "ApiError";
  }
}

async function toApiError(res: Response): Promise<ApiError> {
  try {
    const body = (await res.json()) as ErrorBody;
    return new ApiError(res.status, body.error.code, body.error.message, body.error.details, body.error.fieldErrors);
  } catch {
    return new ApiError(res.status, "internal:error", `The server answered ${res.status}.`);
  }
}

/**
 * The one fetcher for SWR and for mutations: JSON in, JSON out, coded errors thrown as ApiError. Every request but a
 * GET says it is JSON (the server refuses other content types on state-changing requests).
 */
export async function fetchJson<T>(url: string, init?: { method?: string; body?: unknown }): Promise<T> {
  const method = init?.method ?? "GET";
  const res = await fetch(url, {
    method,
    headers: method === "GET" ? undefined : { "content-type": "application/json" },
    body: init?.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (!res.ok) throw await toApiError(res);
  return (await res.json()) as T;
}
