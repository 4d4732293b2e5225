import { closeDb, db } from "@/db/client";
import { caughtMail } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { createMailCatcher, listen } from "./fake-smtp-server";

const server = createMailCatcher(async (m) => {
  await db.insert(caughtMail).values({
    sender: m.sender,
    recipients: m.recipients,
    subject: m.subject,
    textBody: m.text,
    htmlBody: m.html,
  });
});

const port = await listen(server, serverEnv().SMTP_PORT);
console.log(`[bandgate] mail catcher listening on 127.0.0.1:${port}; messages appear under Admin → Mail catcher`);

async function stop() {
  server.close(() => undefined);
  await closeDb();
  process.exit(0);
}
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
