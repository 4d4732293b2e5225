import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { sendMail } from "@/mail/send";
import { releaseEventMail } from "@/mail/templates-registry";
import { loadEventContext } from "./event-context";

/** The e-mail to one family subscriber about one release event. */
export async function sendRegistryMail(eventId: string, userId: string): Promise<void> {
  const ctx = await loadEventContext(eventId);
  const [person] = await db.select({ email: users.email, name: users.name, active: users.active }).from(users).where(eq(users.id, userId));
  if (!ctx || !person?.active) return;
  await sendMail(
    releaseEventMail({
      to: person.email,
      name: person.name,
      kind: ctx.kind,
      familyTitle: ctx.familyTitle,
      version: ctx.version,
      sha256: ctx.sha256,
      reason: ctx.kind === "release.deprecated" ? ctx.deprecationReason : ctx.kind === "release.withdrawn" ? ctx.withdrawalReason : null,
      successorVersion: ctx.successorVersion,
      link: ctx.pageUrl,
    }),
  );
}
