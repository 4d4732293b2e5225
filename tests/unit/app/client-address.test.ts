import { createServer, type IncomingMessage } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clientAddressOf } from "@/lib/auth/client-address-hook";
import { readStampedAddress, UNKNOWN_IP } from "@/lib/auth/client-ip";

/** A real server on loopback: each request is answered with its client address for 0, 1 and 2 trusted proxies. */
const server = createServer((req: IncomingMessage, res) => {
  res.setHeader("content-type", "application/json");
  res.end(JSON.stringify([0, 1, 2].map((n) => clientAddressOf(req, n))));
});
let base = "";
beforeAll(async () => {
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

async function addresses(forwardedFor?: string): Promise<string[]> {
  const res = await fetch(base, { headers: forwardedFor === undefined ? {} : { "x-forwarded-for": forwardedFor } });
  return (await res.json()) as string[];
}

describe("the client address of a request", () => {
  it("is the peer when no proxy is trusted, whatever X-Forwarded-For says", async () => {
    expect((await addresses())[0]).toBe("127.0.0.1");
    expect((await addresses("203.0.113.9"))[0]).toBe("127.0.0.1");
    expect((await addresses("203.0.113.9, 198.51.100.4"))[0]).toBe("127.0.0.1");
  });

  it("is read right to left past the trusted proxies, so a client-written left part never counts", async () => {
    // One proxy appended the address it saw (198.51.100.4); the client wrote 203.0.113.9 itself.
    expect(await addresses("203.0.113.9, 198.51.100.4")).toEqual(["127.0.0.1", "198.51.100.4", "203.0.113.9"]);
    // With fewer entries than trusted hops, the furthest one is all there is.
    expect((await addresses("198.51.100.4"))[2]).toBe("198.51.100.4");
  });

  it("writes one form per address and gives nothing for an entry that is not an address", async () => {
    expect((await addresses("::ffff:198.51.100.4"))[1]).toBe("198.51.100.4");
    expect((await addresses("not-an-address"))[1]).toBe(UNKNOWN_IP);
  });
});

describe("the stamp the app reads", () => {
  it("is believed only with this process's tag", () => {
    expect(readStampedAddress("tag-1 198.51.100.4", "tag-1")).toBe("198.51.100.4");
    expect(readStampedAddress("forged 198.51.100.4", "tag-1")).toBe(UNKNOWN_IP);
    expect(readStampedAddress("tag-1 198.51.100.4", undefined)).toBe(UNKNOWN_IP);
    expect(readStampedAddress(undefined, "tag-1")).toBe(UNKNOWN_IP);
    expect(readStampedAddress("tag-1 garbage", "tag-1")).toBe(UNKNOWN_IP);
  });
});
