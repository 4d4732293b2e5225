import type { ReleaseEventKind } from "./events";

export interface WebhookPayloadInput {
  kind: ReleaseEventKind;
  eventId: string;
  occurredAt: Date;
  family: { slug: string; title: string };
  release: {
    version: string;
    sha256: string;
    releasedAt: Date;
    deprecationReason?: string | null;
    successorVersion?: string | null;
    withdrawalReason?: string | null;
  };
  /** Public base address of the app, e.g. https://bandgate.example.org */
  appUrl: string;
}

/** The JSON body of a webhook delivery; its bytes are signed, so it is built once and stored with the delivery. */
export function webhookBody(input: WebhookPayloadInput): string {
  const api = `${input.appUrl}/api/v1/families/${encodeURIComponent(input.family.slug)}/releases/${encodeURIComponent(input.release.version)}`;
  return JSON.stringify({
    event: input.kind,
    eventId: input.eventId,
    occurredAt: input.occurredAt.toISOString(),
    family: input.family,
    release: {
      version: input.release.version,
      sha256: input.release.sha256,
      releasedAt: input.release.releasedAt.toISOString(),
      ...(input.kind === "release.deprecated" ? { deprecationReason: input.release.deprecationReason ?? null, successorVersion: input.release.successorVersion ?? null } : {}),
      ...(input.kind === "release.withdrawn" ? { withdrawalReason: input.release.withdrawalReason ?? null } : {}),
      api,
      document: `${api}/document`,
    },
  });
}
