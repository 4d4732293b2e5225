import ipaddr from "ipaddr.js";

/**
 * Webhook targets must be public addresses: otherwise anyone with an account could make the worker POST into the
 * private network it runs in. An operator may name extra networks (WEBHOOK_ALLOW_NETWORKS) for receivers of their own.
 */
type Address = ipaddr.IPv4 | ipaddr.IPv6;
export type Network = [Address, number];
export type Resolver = (host: string) => Promise<string[]>;

/** The IPv6 global unicast space (IANA IPv6 address space registry); all else is reserved or special-purpose. */
const GLOBAL_UNICAST = ipaddr.parseCIDR("2000::/3");
/** The well-known NAT64 prefix; the local-use one (64:ff9b:1::/48) is not globally reachable and stays refused. */
const NAT64_WELL_KNOWN = ipaddr.parseCIDR("64:ff9b::/96");

function ipv4Of(high: number, low: number): ipaddr.IPv4 {
  return new ipaddr.IPv4([(high >> 8) & 0xff, high & 0xff, (low >> 8) & 0xff, low & 0xff]);
}

/**
 * Public = globally reachable unicast. ipaddr.js names every range of the IANA IPv4 and IPv6 special-purpose
 * registries, so anything it does not call "unicast" is refused (also the reachable but host-less AS112 and AMT
 * anycast ranges). Forms that carry an IPv4 address are judged by it: IPv4-mapped (the socket really goes to it),
 * NAT64, 6to4 and Teredo (server and de-obfuscated client address). ipaddr.js calls every IPv6 address outside its
 * named ranges unicast, including the IPv4-compatible ::a.b.c.d and other unallocated space, hence the 2000::/3 test.
 */
export function isPublicAddress(address: Address): boolean {
  if (address.kind() === "ipv4") return address.range() === "unicast";
  const v6 = address as ipaddr.IPv6;
  if (v6.isIPv4MappedAddress()) return isPublicAddress(v6.toIPv4Address());
  const p = v6.parts;
  switch (v6.range()) {
    case "rfc6052":
      return v6.match(NAT64_WELL_KNOWN) && isPublicAddress(ipv4Of(p[6], p[7]));
    case "6to4":
      return isPublicAddress(ipv4Of(p[1], p[2]));
    case "teredo":
      return isPublicAddress(ipv4Of(p[2], p[3])) && isPublicAddress(ipv4Of(~p[6], ~p[7]));
    case "unicast":
      return v6.match(GLOBAL_UNICAST);
    default:
      return false;
  }
}

/** "10.1.0.0/16, 127.0.0.1/32" → networks; throws on anything that is not a CIDR network. */
export function parseNetworks(text: string): Network[] {
  return text
    .split(",")
    .map((part) => part.trim())
    .filter(Boolean)
    .map((cidr) => {
      if (!ipaddr.isValidCIDR(cidr)) throw new Error(`"${cidr}" is not a network in CIDR notation (e.g. 127.0.0.1/32)`);
      return ipaddr.parseCIDR(cidr);
    });
}

/**
 * May a socket connect to this address? Public addresses yes; others only inside a network the operator listed,
 * matched against the address connected to (an IPv4-mapped IPv6 address is its IPv4 address).
 */
export function mayConnectTo(ip: string, allowed: readonly Network[]): boolean {
  if (!ipaddr.isValid(ip)) return false;
  const address = ipaddr.process(ip);
  return isPublicAddress(address) || allowed.some((net) => net[0].kind() === address.kind() && address.match(net));
}

export const NOT_PUBLIC = "not a public address";

/** The host of a URL as a socket sees it: IPv6 literals without their brackets. */
export function hostOf(url: URL): string {
  return url.hostname.replace(/^\[|\]$/g, "");
}

/** null when the URL may be called now; otherwise the reason it may not. The worker checks again when it connects. */
export async function webhookTargetProblem(url: string, resolve: Resolver, allowed: readonly Network[]): Promise<string | null> {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return "not a valid address";
  }
  if (parsed.protocol !== "http:" && parsed.protocol !== "https:") return "only http and https addresses are called";
  const host = hostOf(parsed);
  let addresses: string[];
  try {
    addresses = ipaddr.isValid(host) ? [host] : await resolve(host);
  } catch {
    return `the host ${host} could not be resolved`;
  }
  if (addresses.length === 0) return `the host ${host} has no address`;
  return addresses.every((a) => mayConnectTo(a, allowed)) ? null : NOT_PUBLIC;
}
