import { randomBytes } from "node:crypto";
import { subscribe } from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import proxyaddr from "proxy-addr";
import { CLIENT_ADDRESS_HEADER, CLIENT_ADDRESS_TAG, normaliseAddress, UNKNOWN_IP } from "./client-ip";

/**
 * Why a hook: under `next start`, Next's server does `x-forwarded-for ??= socket.remoteAddress` (base-server.js) — it
 * writes the peer address only when the request has no X-Forwarded-For, and keeps a client-written one as it is. No
 * request object the app gets (route handlers, server actions, next-auth's authorize) carries the socket. So this hook
 * sees each request before Next does (Node's `http.server.request.start` diagnostics channel, published just before
 * the server's "request" event), works out the client address with proxy-addr from the real peer address and the
 * X-Forwarded-For chain, trusting exactly `trustedProxies` hops from the right (0: the peer itself), and stamps it in
 * a header of its own, replacing any copy the client sent.
 *
 * Requests accepted in the moment between `listen` and this hook's installation (instrumentation's register) would
 * pass unstamped, so the stamp carries a random tag of this process and the app believes only a stamp with that tag.
 */
export function installClientAddressHook(trustedProxies: number): void {
  const state = globalThis as { [CLIENT_ADDRESS_TAG]?: string };
  if (state[CLIENT_ADDRESS_TAG]) return;
  const tag = randomBytes(16).toString("hex");
  subscribe("http.server.request.start", (message) => {
    const request = (message as { request: IncomingMessage }).request;
    request.headers[CLIENT_ADDRESS_HEADER] = `${tag} ${clientAddressOf(request, trustedProxies)}`;
  });
  state[CLIENT_ADDRESS_TAG] = tag;
}

/** The client address of a request on the wire: hop 0 is the peer, hop n the n-th X-Forwarded-For entry from the right. */
export function clientAddressOf(request: IncomingMessage, trustedProxies: number): string {
  try {
    return normaliseAddress(proxyaddr(request, (_address, hop) => hop < trustedProxies)) ?? UNKNOWN_IP;
  } catch {
    return UNKNOWN_IP; // proxy-addr refuses a malformed chain
  }
}
