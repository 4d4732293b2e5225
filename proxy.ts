import { NextResponse, type NextRequest } from "next/server";
import { serverEnv } from "@/lib/env";
import { contentSecurityPolicy, transportSecurity } from "@/lib/security-headers";

/**
 * Runs before every request except build assets: refuses addresses holding a NUL byte (400, before any page or
 * route could pass it to PostgreSQL), and gives each response a content security policy with a fresh script nonce.
 */
export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(18))).toString("base64");
  const policy = contentSecurityPolicy(nonce, { dev: process.env.NODE_ENV === "development" });
  if (/%00/.test(request.url)) {
    const refused = NextResponse.json({ error: { code: "invalid:address", message: "The address holds a NUL character (%00)." } }, { status: 400 });
    refused.headers.set("content-security-policy", policy);
    return refused;
  }
  // Next reads the nonce from the policy among the request headers and puts it on its own scripts; no page of
  // ours renders a script itself, so no separate nonce header is passed on.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  const hsts = transportSecurity(serverEnv().APP_URL);
  if (hsts) response.headers.set("strict-transport-security", hsts);
  return response;
}

export const config = {
  // Build assets (and the worker script, which must not inherit a nonce policy for its importScripts) are static.
  matcher: ["/((?!_next/static|_next/image).*)"],
};
