import "server-only";
import { z } from "zod";
import { serverEnv } from "./env";
import { AppError, fieldErrorsOf, toErrorResponse } from "./errors";
import { findNul, NUL_MESSAGE } from "./pg-text";
import { assertSameOriginJson, originsOf } from "./request-guard";
import { JSON_BODY_LIMIT, readBodyText, type BodyLimit } from "./http-body";

/** The JSON body, unvalidated (for services that validate it themselves); too large is a 413, bad JSON or a NUL in any text a 400. */
export async function readJsonBody(request: Request, limit: BodyLimit = JSON_BODY_LIMIT): Promise<unknown> {
  const text = await readBodyText(request, limit);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new AppError("invalid:json", "The request body is not valid JSON.");
  }
  const nulAt = findNul(body);
  if (nulAt !== null) throw new AppError("invalid:input", NUL_MESSAGE, { [nulAt]: [NUL_MESSAGE] });
  return body;
}

/** Parse a JSON request body with zod; too large is a 413, bad JSON or a bad shape a 400 with field errors. */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S, limit: BodyLimit = JSON_BODY_LIMIT): Promise<z.output<S>> {
  const raw = await readJsonBody(request, limit);
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new AppError("invalid:input", "The request body has problems.", fieldErrorsOf(parsed.error));
  return parsed.data;
}

let appOrigins: string[] | undefined;

/**
 * Wrap a route handler: a state-changing request must come from the app's own origin with a JSON body (403/415
 * before the handler runs), and every thrown error becomes the coded JSON error response.
 */
export function handleRoute<R extends unknown[]>(fn: (request: Request, ...rest: R) => Promise<Response>) {
  return async (request: Request, ...rest: R): Promise<Response> => {
    try {
      appOrigins ??= originsOf([serverEnv().APP_URL, serverEnv().NEXTAUTH_URL]);
      assertSameOriginJson(request, appOrigins);
      return await fn(request, ...rest);
    } catch (err) {
      const { body, status } = toErrorResponse(err);
      return Response.json(body, { status });
    }
  };
}

/** Route params such as ids, validated like bodies; a malformed id is simply not found. */
export function parseIdParam(value: string, what: string): string {
  const parsed = z.uuid().safeParse(value);
  if (!parsed.success) throw new AppError(`not-found:${what}`, `That ${what} does not exist.`);
  return parsed.data;
}
