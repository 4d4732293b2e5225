import { spawn, type ChildProcess } from "node:child_process";
import pg from "pg";
import { createMailCatcher, listen } from "@/mail/fake-smtp-server";
import { freePort, waitForReady } from "../support/app-server";

/**
 * Integration tests run against the real PostgreSQL named by DATABASE_URL (scripts/test.sh creates a fresh
 * bandgate_test database) and against the built app served by `next start` on a free port.
 */
let app: ChildProcess | undefined;
let catcher: ReturnType<typeof createMailCatcher> | undefined;

export async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL ?? "";
  if (!/_test(\?|$)/.test(url)) {
    throw new Error("Integration tests need DATABASE_URL to name a *_test database (run them with `npm test`).");
  }
  const pool = new pg.Pool({ connectionString: url });
  catcher = createMailCatcher(async (m) => {
    await pool.query("insert into caught_mail (sender, recipients, subject, text_body, html_body) values ($1, $2, $3, $4, $5)", [
      m.sender,
      m.recipients,
      m.subject,
      m.text,
      m.html,
    ]);
  });
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String(await listen(catcher, 0));

  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  process.env.APP_URL = base;
  process.env.TEST_APP_URL = base;
  process.env.NEXTAUTH_URL = base;
  process.env.NEXTAUTH_SECRET ??= "integration-secret-not-for-production";
  app = spawn("node_modules/.bin/next", ["start", "-p", String(port), "-H", "127.0.0.1"], {
    env: { ...process.env },
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitForReady(`${base}/api/health`, 60);
}

export async function teardown(): Promise<void> {
  app?.kill("SIGTERM");
  await new Promise<void>((resolve) => (catcher ? catcher.close(() => resolve()) : resolve()));
}
