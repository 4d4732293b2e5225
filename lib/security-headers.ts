/**
 * Security headers. The content security policy is built per request around a fresh nonce (proxy.ts); Next puts
 * that nonce on its own scripts when it finds the policy among the request headers, so no other script runs.
 */
export interface PolicyOptions {
  /** `next dev` evaluates code for its overlay and reloads over a WebSocket. */
  dev: boolean;
}

export function contentSecurityPolicy(nonce: string, { dev }: PolicyOptions): string {
  const directives: Record<string, string[]> = {
    "default-src": ["'self'"],
    // strict-dynamic: chunks that Next's nonce-bearing scripts load are trusted; nothing else, nothing inline.
    "script-src": ["'self'", `'nonce-${nonce}'`, "'strict-dynamic'", ...(dev ? ["'unsafe-eval'"] : [])],
    // KaTeX and the plots set style attributes in server-rendered HTML, which a nonce cannot cover.
    "style-src": ["'self'", "'unsafe-inline'"],
    // blob: for the band plot's PNG export, which draws the SVG through an image.
    "img-src": ["'self'", "data:", "blob:"],
    "font-src": ["'self'"],
    "connect-src": ["'self'", ...(dev ? ["ws:"] : [])],
    // The model editor computes bands in a worker loaded from /_next/static.
    "worker-src": ["'self'"],
    "frame-ancestors": ["'none'"],
    "object-src": ["'none'"],
    "base-uri": ["'self'"],
    "form-action": ["'self'"],
  };
  return Object.entries(directives)
    .map(([name, values]) => [name, ...values].join(" "))
    .join("; ");
}

/** Browser features the app never uses, switched off for it and anything it might embed. */
const UNUSED_FEATURES = ["accelerometer", "camera", "display-capture", "geolocation", "gyroscope", "hid", "magnetometer", "microphone", "midi", "payment", "serial", "usb"];

/** Headers that are the same on every response, static files included (next.config.ts). */
export const STATIC_SECURITY_HEADERS: readonly { key: string; value: string }[] = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "Permissions-Policy", value: UNUSED_FEATURES.map((f) => `${f}=()`).join(", ") },
];

/** HSTS only when the public address is https: on plain http it would be ignored, and wrong for a later http setup. */
export function transportSecurity(appUrl: string): string | null {
  return new URL(appUrl).protocol === "https:" ? "max-age=31536000" : null;
}
