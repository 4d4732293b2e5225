import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";

export interface Received {
  path: string;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/** A webhook receiver that records every request and answers with the next status in `script` (then 200). */
export interface Receiver {
  host: string;
  port: number;
  received: Received[];
  script: number[];
  url(path: string): string;
  close(): Promise<void>;
}

/** Listens on `host` (at `port`, or a free one), e.g. 127.0.0.1 and 127.0.0.2 on one port to tell two targets apart. */
export async function startReceiver(host: string, port = 0): Promise<Receiver> {
  const received: Received[] = [];
  const script: number[] = [];
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      received.push({ path: req.url ?? "", headers: req.headers, body: Buffer.concat(chunks).toString("utf8") });
      res.statusCode = script.shift() ?? 200;
      res.end("ok");
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, resolve);
  });
  const bound = (server.address() as AddressInfo).port;
  return {
    host,
    port: bound,
    received,
    script,
    url: (path) => `http://${host}:${bound}${path}`,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
