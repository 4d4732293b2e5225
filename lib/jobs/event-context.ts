import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { modelFamilies, releaseEvents, releases } from "@/db/schema";
import { serverEnv } from "@/lib/env";

/** Everything a notification about one release event says: the event, its release, family and successor. */
export async function loadEventContext(eventId: string) {
  const [row] = await db
    .select({
      eventId: releaseEvents.id,
      kind: releaseEvents.kind,
      occurredAt: releaseEvents.createdAt,
      familyId: modelFamilies.id,
      familySlug: modelFamilies.slug,
      familyTitle: modelFamilies.title,
      version: releases.version,
      sha256: releases.sha256,
      releasedAt: releases.createdAt,
      deprecationReason: releases.deprecationReason,
      withdrawalReason: releases.withdrawalReason,
      successorId: releases.successorId,
    })
    .from(releaseEvents)
    .innerJoin(releases, eq(releases.id, releaseEvents.releaseId))
    .innerJoin(modelFamilies, eq(modelFamilies.id, releases.familyId))
    .where(eq(releaseEvents.id, eventId));
  if (!row) return null;
  const [successor] = row.successorId ? await db.select({ version: releases.version }).from(releases).where(eq(releases.id, row.successorId)) : [];
  const appUrl = serverEnv().APP_URL.replace(/\/$/, "");
  return {
    ...row,
    successorVersion: successor?.version ?? null,
    appUrl,
    pageUrl: `${appUrl}/registry/${encodeURIComponent(row.familySlug)}/${encodeURIComponent(row.version)}`,
  };
}

export type EventContext = NonNullable<Awaited<ReturnType<typeof loadEventContext>>>;
