import { isIP } from "node:net";

/**
 * Webhook targets must be public addresses: otherwise anyone with an account could make the worker POST into the
 * private network it runs in. Local set-ups (npm start, npm test) allow private targets explicitly.
 */
function v4Private(ip: string): boolean {
  const [a, b] = ip.split(".").map(Number);
  return (
    a === 0 || a === 10 || a === 127 || (a === 100 && b >= 64 && b <= 127) || (a === 169 && b === 254) ||
    (a === 172 && b >= 16 && b <= 31) || (a === 192 && b === 168) || (a === 198 && (b === 18 || b === 19)) || a >= 224
  );
}

export function isPrivateAddress(ip: string): boolean {
  const family = isIP(ip);
  if (family === 4) return v4Private(ip);
  if (family !== 6) return true;
  const lower = ip.toLowerCase();
  const mapped = lower.match(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/);
  if (mapped) return v4Private(mapped[1]);
  return lower === "::" || lower === "::1" || /^f[cd]/.test(lower) || /^fe[89ab]/.test(lower) || lower.startsWith("ff");
}

export type Resolver = (host: string) => Promise<string[]>;

/** null when the URL may be called; otherwise the reason it may not. */
export async function webhookTargetProblem(url: string, resolve: Resolver, allowPrivate: boolean): Promise<string | null> {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return "not a valid address";
  }
  if (parsed.protocol !== "http:" && parsed.protocol !== "https:") return "only http and https addresses are called";
  if (allowPrivate) return null;
  const host = parsed.hostname.replace(/^\[|\]$/g, "");
  if (host === "localhost" || host.endsWith(".localhost")) return "private or local addresses are not called";
  let addresses: string[];
  try {
    addresses = isIP(host) ? [host] : await resolve(host);
  } catch {
    return `the host ${host} could not be resolved`;
  }
  if (addresses.length === 0) return `the host ${host} has no address`;
  return addresses.some(isPrivateAddress) ? "private or local addresses are not called" : null;
}
