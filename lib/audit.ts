import type { Tx } from "@/db/client";
import { auditEvents } from "@/db/schema";

export interface AuditEntry {
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId?: string | null;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
}

/** Append one event to the audit trail inside the caller's transaction (the table refuses updates and deletes). */
export async function recordAudit(tx: Tx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    actorId: entry.actorId,
    action: entry.action,
    subjectType: entry.subjectType,
    subjectId: entry.subjectId ?? null,
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
