import { randomInt } from "node:crypto";
import { request } from "node:http";

/**
 * A loopback address of this test alone, so no other test (or an earlier run) has counted sign-in attempts or reset
 * mails from it.
 */
export function freshLoopbackAddress(): string {
  return `127.${randomInt(1, 255)}.${randomInt(0, 256)}.${randomInt(1, 255)}`;
}

/**
 * fetch over plain HTTP from a chosen loopback address (127.0.0.0/8 all reach this machine), so a test can be a
 * client at another peer address than every other test. Bodies are strings or URLSearchParams, as the tests send them.
 */
export function fetchFrom(localAddress: string): typeof fetch {
  return (async (input: string | URL | Request, init: RequestInit = {}) => {
    const url = new URL(String(input));
    const headers = new Headers(init.headers);
    const body = init.body === undefined || init.body === null ? undefined : String(init.body);
    if (body !== undefined && init.body instanceof URLSearchParams && !headers.has("content-type")) {
      headers.set("content-type", "application/x-www-form-urlencoded");
    }
    return new Promise<Response>((resolve, reject) => {
      const req = request(
        url,
        { method: init.method ?? "GET", headers: Object.fromEntries(headers), localAddress, signal: init.signal ?? undefined },
        (res) => {
          const chunks: Buffer[] = [];
          res.on("data", (c: Buffer) => chunks.push(c));
          res.on("end", () => {
            const out = new Headers();
            for (const [name, value] of Object.entries(res.headers)) {
              for (const v of Array.isArray(value) ? value : value === undefined ? [] : [value]) out.append(name, v);
            }
            const status = res.statusCode ?? 0;
            const noBody = status === 204 || status === 304;
            resolve(new Response(noBody ? null : Buffer.concat(chunks), { status, headers: out }));
          });
          res.on("error", reject);
        },
      );
      req.on("error", reject);
      req.end(body);
    });
  }) as typeof fetch;
}
