import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface CaughtMessage {
  sender: string;
  recipients: string[];
  subject: string;
  text: string;
  html: string | null;
}

/**
 * A real SMTP listener on 127.0.0.1 that accepts every message and hands it to `store`.
 * Used in development and tests instead of a mail server.
 */
export function createMailCatcher(store: (message: CaughtMessage) => Promise<void>): SMTPServer {
  return new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 2 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) =>
          store({
            sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            recipients: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "(no subject)",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
          }),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
}

export function listen(server: SMTPServer, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => {
      const address = server.server.address();
      resolve(typeof address === "object" && address ? address.port : port);
    });
  });
}
