import { request as httpRequest } from "node:http";
import { request as httpsRequest } from "node:https";
import { isIP, type LookupFunction } from "node:net";
import { hostOf, mayConnectTo, NOT_PUBLIC, type Network, type Resolver } from "@/lib/registry/webhook-target";

const EXCERPT = 500;
/** Bytes of the answer read for the excerpt; the rest is never read. */
const READ_LIMIT = 4 * EXCERPT;

export const REFUSED = `refused: ${NOT_PUBLIC}`;

export interface PostResult {
  statusCode: number | null;
  error: string | null;
  excerpt: string | null;
  ms: number;
  /** Nothing was sent and a retry would not change that (the address is not one the worker may connect to). */
  final: boolean;
}

export interface PostOptions {
  resolve: Resolver;
  allowed: readonly Network[];
  timeoutMs: number;
}

class RefusedAddress extends Error {}

/**
 * The socket's own name lookup: one resolution, refused unless every address may be reached, and the socket then
 * connects to an address from that same answer. So a name cannot pass a check and resolve elsewhere for the connect.
 */
function checkedLookup(resolve: Resolver, allowed: readonly Network[]): LookupFunction {
  return (hostname, options, callback) => {
    resolve(hostname).then(
      (addresses) => {
        if (addresses.length === 0) return callback(new Error(`the host ${hostname} has no address`), "");
        if (!addresses.every((a) => mayConnectTo(a, allowed))) return callback(new RefusedAddress(REFUSED), "");
        const wanted = addresses
          .map((address) => ({ address, family: isIP(address) }))
          .filter((a) => !options.family || options.family === a.family);
        if (wanted.length === 0) return callback(new Error(`the host ${hostname} has no IPv${options.family} address`), "");
        if (options.all) callback(null, wanted);
        else callback(null, wanted[0].address, wanted[0].family);
      },
      (err: NodeJS.ErrnoException) => callback(err, ""),
    );
  };
}

function elapsed(started: number): number {
  return performance.now() - started;
}

/**
 * POST a body to a webhook URL without following redirects. Literal addresses are checked here (a socket does no
 * lookup for them), names in the socket's lookup. A refused address is never connected to, so the log shows the same
 * thing whether a port there is open or closed.
 */
export function postWebhook(target: string, body: string, headers: Record<string, string>, options: PostOptions): Promise<PostResult> {
  const started = performance.now();
  const url = new URL(target);
  const host = hostOf(url);
  if ((url.protocol !== "http:" && url.protocol !== "https:") || (isIP(host) && !mayConnectTo(host, options.allowed))) {
    return Promise.resolve({ statusCode: null, error: REFUSED, excerpt: null, ms: elapsed(started), final: true });
  }
  const signal = AbortSignal.timeout(options.timeoutMs);
  const send = url.protocol === "https:" ? httpsRequest : httpRequest;
  return new Promise((settle) => {
    let settled = false;
    const finish = (result: Omit<PostResult, "ms" | "final"> & { final?: boolean }) => {
      if (settled) return;
      settled = true;
      settle({ final: false, ...result, ms: elapsed(started) });
    };
    const req = send(
      url,
      { method: "POST", headers: { ...headers, "content-length": String(Buffer.byteLength(body)) }, agent: false, lookup: checkedLookup(options.resolve, options.allowed), signal },
      (res) => {
        const status = res.statusCode ?? 0;
        const chunks: Buffer[] = [];
        let size = 0;
        const done = () => {
          const text = Buffer.concat(chunks).toString("utf8").slice(0, EXCERPT);
          finish({ statusCode: status, error: status >= 200 && status < 300 ? null : `HTTP ${status}`, excerpt: text || null });
          res.destroy();
        };
        res.on("data", (chunk: Buffer) => {
          chunks.push(chunk);
          size += chunk.length;
          if (size >= READ_LIMIT) done();
        });
        res.on("end", done);
        res.on("error", done);
        res.on("close", done);
      },
    );
    req.on("error", (err) => {
      if (err instanceof RefusedAddress) finish({ statusCode: null, error: REFUSED, excerpt: null, final: true });
      else finish({ statusCode: null, error: signal.aborted ? "timed out" : err.message, excerpt: null });
    });
    req.end(body);
  });
}
