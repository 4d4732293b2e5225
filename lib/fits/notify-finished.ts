import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { proposals, users } from "@/db/schema";
import { notifications } from "@/board/notify";
import { serverEnv } from "@/lib/env";
import { sendMail } from "@/mail/send";
import { fitFinishedMail } from "@/mail/templates-review";
import { getFitRun } from "./queries";
import { FIT_STATUS_LABEL, shouldMailFit } from "./record";

/** Tells the person who started a fit how it ended. Best effort, after the outcome is committed. */
export async function notifyFitFinished(fitId: string): Promise<void> {
  if (!notifications.enabled) return;
  try {
    const row = await getFitRun(db, fitId);
    if (!row || !shouldMailFit(row.run.status, row.run.elapsedMs)) return;
    const [who] = await db
      .select({ email: users.email, active: users.active, title: proposals.title })
      .from(users)
      .innerJoin(proposals, eq(proposals.id, row.run.proposalId))
      .where(eq(users.id, row.run.startedBy));
    if (!who?.active) return;
    const o = row.run.outcome;
    const details = [
      ...(o ? [`RMS ${(o.rms * 1000).toFixed(2)} meV, max ${(o.maxAbs * 1000).toFixed(2)} meV over ${o.points} values; ${o.iterations} iterations in ${(o.elapsedMs / 1000).toFixed(0)} s (${o.reason}).`] : []),
      row.resultRevisionNumber !== null ? `Saved as revision ${row.resultRevisionNumber}.` : (row.run.applyNote ?? row.run.failureReason ?? ""),
    ].filter(Boolean);
    const link = new URL(`/proposals/${row.run.proposalId}/fits/${fitId}`, serverEnv().APP_URL).toString();
    await sendMail(fitFinishedMail(who.email, { title: who.title, outcome: FIT_STATUS_LABEL[row.run.status], details, link }));
  } catch (err) {
    console.error("[bandgate] fit notice not delivered", fitId, err instanceof Error ? err.message : err);
  }
}
