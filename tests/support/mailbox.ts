import { desc, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { caughtMail } from "@/db/schema";

export async function mailTo(address: string) {
  return db
    .select()
    .from(caughtMail)
    .where(sql`${caughtMail.recipients} @> array[${address}]::text[]`)
    .orderBy(desc(caughtMail.id));
}

/** The first link in the newest message to `address` whose path starts with `prefix`. */
export async function linkFromLatestMail(address: string, prefix: string): Promise<string> {
  const [latest] = await mailTo(address);
  if (!latest) throw new Error(`no mail to ${address}`);
  const link = latest.textBody.match(/https?:\/\/\S+/g)?.find((l) => new URL(l).pathname.startsWith(prefix));
  if (!link) throw new Error(`no ${prefix} link in mail to ${address}`);
  return link;
}
