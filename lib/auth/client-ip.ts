import ipaddr from "ipaddr.js";

/**
 * The address a request came from, as stamped by the client-address hook (client-address-hook.ts, installed by
 * instrumentation.ts): the peer address, or with TRUSTED_PROXY_COUNT proxies in front the entry that many hops from
 * the right of X-Forwarded-For. Never read X-Forwarded-For here: its left part is whatever the client wrote.
 */
export const UNKNOWN_IP = "unknown";
export const CLIENT_ADDRESS_HEADER = "x-bandgate-client-address";
/** Where the hook keeps this process's stamp tag (globalThis: shared by instrumentation and the app's bundles). */
export const CLIENT_ADDRESS_TAG = Symbol.for("bandgate.client-address-tag");

/** One canonical text per address (IPv4-mapped IPv6 as plain IPv4), or null for anything that is not an address. */
export function normaliseAddress(raw: string | undefined): string | null {
  if (!raw || !ipaddr.isValid(raw)) return null;
  return ipaddr.process(raw).toString();
}

/** The address in a stamp made with `tag`, or "unknown" for a missing, foreign or malformed stamp. */
export function readStampedAddress(stamp: string | null | undefined, tag: string | undefined): string {
  if (!stamp || !tag) return UNKNOWN_IP;
  const [stampTag, address] = stamp.split(" ");
  if (stampTag !== tag) return UNKNOWN_IP;
  return normaliseAddress(address) ?? UNKNOWN_IP;
}

export function clientIp(headers: Headers | Record<string, string | string[] | undefined> | undefined): string {
  const raw = headers instanceof Headers ? headers.get(CLIENT_ADDRESS_HEADER) : headers?.[CLIENT_ADDRESS_HEADER];
  const tag = (globalThis as { [CLIENT_ADDRESS_TAG]?: string })[CLIENT_ADDRESS_TAG];
  return readStampedAddress(Array.isArray(raw) ? raw[0] : raw, tag);
}
