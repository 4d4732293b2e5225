import "server-only";
import { z } from "zod";
import { AppError, fieldErrorsOf, toErrorResponse } from "./errors";
import { JSON_BODY_LIMIT, readBodyText, type BodyLimit } from "./http-body";

/** The JSON body, unvalidated (for services that validate it themselves); too large is a 413, bad JSON a 400. */
export async function readJsonBody(request: Request, limit: BodyLimit = JSON_BODY_LIMIT): Promise<unknown> {
  const text = await readBodyText(request, limit);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid:json", "The request body is not valid JSON.");
  }
}

/** Parse a JSON request body with zod; too large is a 413, bad JSON or a bad shape a 400 with field errors. */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S, limit: BodyLimit = JSON_BODY_LIMIT): Promise<z.output<S>> {
  const raw = await readJsonBody(request, limit);
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new AppError("invalid:input", "The request body has problems.", fieldErrorsOf(parsed.error));
  return parsed.data;
}

/** Wrap a route handler so every thrown error becomes the coded JSON error response. */
export function handleRoute<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await fn(...args);
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
