import { AppError } from "./errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** The origins (scheme://host:port) the app is served from, e.g. APP_URL and NEXTAUTH_URL. */
export function originsOf(urls: readonly (string | undefined)[]): string[] {
  return [...new Set(urls.filter((u): u is string => Boolean(u)).map((u) => new URL(u).origin))];
}

/**
 * Cross-site request forgery: another page (another site, or another port of this one) can make a signed-in browser
 * send a POST with its cookies, but only with that page's Origin and a form's content type. A state-changing request
 * must therefore come from one of the app's own origins (browsers always send Origin on unsafe methods, so a missing
 * one is refused too; Sec-Fetch-Site, when sent, must say same-origin) and carry JSON, which no form can send.
 */
export function assertSameOriginJson(request: Request, origins: readonly string[]): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const site = request.headers.get("sec-fetch-site");
  const origin = request.headers.get("origin");
  if ((site !== null && site !== "same-origin") || origin === null || !origins.includes(origin)) {
    throw new AppError("forbidden:origin", "This request did not come from a Bandgate page of this site, so it was refused.");
  }
  const type = request.headers.get("content-type")?.split(";")[0].trim().toLowerCase();
  if (type !== "application/json") {
    throw new AppError("unsupported:media-type", "Send the request body as JSON, with Content-Type: application/json.");
  }
}
