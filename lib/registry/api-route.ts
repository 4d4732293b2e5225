import "server-only";
import { AppError, toErrorResponse } from "@/lib/errors";
import { rateHeaders, type RateDecision } from "./rate-limit";

/**
 * Route handlers of API v1: every thrown error becomes the coded JSON error, with WWW-Authenticate on 401 and the
 * rate headers (Retry-After included) on 429.
 */
export function apiRoute<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await fn(...args);
    } catch (err) {
      const { body, status } = toErrorResponse(err);
      const headers = new Headers({ "Cache-Control": "no-store" });
      if (status === 401) headers.set("WWW-Authenticate", 'Bearer realm="bandgate"');
      if (err instanceof AppError && err.details?.rate) {
        for (const [k, v] of Object.entries(rateHeaders(err.details.rate as RateDecision))) headers.set(k, v);
        return Response.json({ error: { ...body.error, details: undefined } }, { status, headers });
      }
      return Response.json(body, { status, headers });
    }
  };
}
