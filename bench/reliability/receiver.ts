import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";

export interface Receipt {
  path: string;
  deliveryId: string;
  eventId: string | null;
  at: number;
}

/**
 * A webhook subscriber on 127.0.0.1 that answers 200 after `delayMs`, so a fan-out lasts long enough to be
 * interrupted, and remembers every POST it answered (a receipt counts only once its 200 was sent).
 */
export class WebhookReceiver {
  readonly receipts: Receipt[] = [];
  private server: Server | null = null;
  private readonly arrivals = new Set<(eventId: string | null) => void>();
  port = 0;

  constructor(private readonly delayMs: number) {}

  async listen(port: number): Promise<void> {
    this.server = createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on("data", (c: Buffer) => chunks.push(c));
      req.on("end", () => {
        let eventId: string | null = null;
        try {
          eventId = (JSON.parse(Buffer.concat(chunks).toString("utf8")) as { eventId?: string }).eventId ?? null;
        } catch {
          // counted with a null event
        }
        for (const notify of this.arrivals) notify(eventId);
        setTimeout(() => {
          res.statusCode = 200;
          res.end("ok", () => this.receipts.push({ path: req.url ?? "", deliveryId: String(req.headers["bandgate-delivery"] ?? ""), eventId, at: performance.now() }));
        }, this.delayMs);
      });
    });
    await new Promise<void>((resolve, reject) => {
      this.server!.once("error", reject);
      this.server!.listen(port, "127.0.0.1", resolve);
    });
    this.port = (this.server.address() as AddressInfo).port;
  }

  /** Resolves when a POST of the event has arrived and is not answered yet: a delivery in flight. */
  nextArrival(eventId: string): Promise<true> {
    return new Promise((resolve) => {
      const notify = (id: string | null) => {
        if (id !== eventId) return;
        this.arrivals.delete(notify);
        resolve(true);
      };
      this.arrivals.add(notify);
    });
  }

  forEvent(eventId: string): Receipt[] {
    return this.receipts.filter((r) => r.eventId === eventId);
  }

  close(): Promise<void> {
    return new Promise((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
