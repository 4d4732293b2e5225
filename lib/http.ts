import "server-only";
import type { z } from "zod";
import { fieldErrorsOf } from "./action";
import { AppError, toErrorResponse } from "./errors";

/** Parse a JSON request body with zod; bad JSON or a bad shape is a 400 with field errors. */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  let raw: unknown;
  try {
    raw = await request.json();
  } catch {
    throw new AppError("invalid:json", "The request body is not valid JSON.");
  }
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
