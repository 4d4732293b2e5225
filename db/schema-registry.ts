import { sql } from "drizzle-orm";
import { bigserial, boolean, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { RELEASE_EVENT_KINDS } from "@/lib/registry/events";
import { modelFamilies, releases, users } from "./schema";

/* Registry tables: API tokens and their rate windows, subscriptions, release events and webhook deliveries. */

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** sha256 of the token; the token itself is shown once and never stored. */
    tokenHash: text("token_hash").notNull(),
    /** The first characters, so the owner can tell tokens apart. */
    prefix: text("prefix").notNull(),
    scope: text("scope").notNull().default("read"),
    requestsPerMinute: integer("requests_per_minute").notNull().default(600),
    createdAt: createdAt(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("api_tokens_token_hash_key").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);
export type ApiToken = typeof apiTokens.$inferSelect;

/** Requests per token per fixed one-minute window, counted in PostgreSQL so every web node agrees. */
export const apiRateWindows = pgTable(
  "api_rate_windows",
  {
    tokenId: uuid("token_id")
      .notNull()
      .references(() => apiTokens.id, { onDelete: "cascade" }),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull(),
    hits: integer("hits").notNull(),
  },
  (t) => [primaryKey({ columns: [t.tokenId, t.windowStart] }), index("api_rate_windows_start_idx").on(t.windowStart)],
);

/** People told by e-mail when a family gets a release, deprecation or withdrawal. */
export const familySubscriptions = pgTable(
  "family_subscriptions",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    familyId: uuid("family_id")
      .notNull()
      .references(() => modelFamilies.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.familyId] }), index("family_subscriptions_family_idx").on(t.familyId)],
);

export const webhookSubscriptions = pgTable(
  "webhook_subscriptions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    familyId: uuid("family_id")
      .notNull()
      .references(() => modelFamilies.id, { onDelete: "cascade" }),
    url: text("url").notNull(),
    /** Kept in clear: every delivery is signed with it (HMAC-SHA256 over the body). */
    secret: text("secret").notNull(),
    active: boolean("active").notNull().default(true),
    createdAt: createdAt(),
  },
  (t) => [index("webhook_subscriptions_family_idx").on(t.familyId, t.active), index("webhook_subscriptions_user_idx").on(t.userId)],
);
export type WebhookSubscription = typeof webhookSubscriptions.$inferSelect;

export const releaseEventKindEnum = pgEnum("release_event_kind", RELEASE_EVENT_KINDS);

/** What downstream codes are told about; written in the same transaction as the change itself. */
export const releaseEvents = pgTable(
  "release_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    releaseId: uuid("release_id")
      .notNull()
      .references(() => releases.id),
    kind: releaseEventKindEnum("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    /** When the worker turned the event into deliveries and e-mails; null until then (a sweep re-queues stragglers). */
    fannedOutAt: timestamp("fanned_out_at", { withTimezone: true }),
  },
  (t) => [index("release_events_release_idx").on(t.releaseId), index("release_events_unsent_idx").on(t.createdAt).where(sql`fanned_out_at is null`)],
);
export type ReleaseEvent = typeof releaseEvents.$inferSelect;

export const deliveryStatusEnum = pgEnum("webhook_delivery_status", ["pending", "delivered", "failed"]);

export const webhookDeliveries = pgTable(
  "webhook_deliveries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    eventId: uuid("event_id")
      .notNull()
      .references(() => releaseEvents.id),
    subscriptionId: uuid("subscription_id")
      .notNull()
      .references(() => webhookSubscriptions.id, { onDelete: "cascade" }),
    /** The exact body sent (and signed) on every attempt. */
    body: text("body").notNull(),
    status: deliveryStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    deliveredAt: timestamp("delivered_at", { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("webhook_deliveries_event_subscription_key").on(t.eventId, t.subscriptionId), index("webhook_deliveries_subscription_idx").on(t.subscriptionId, t.createdAt)],
);
export type WebhookDelivery = typeof webhookDeliveries.$inferSelect;

/** One row per attempt: the delivery log the subscriber reads. */
export const webhookAttempts = pgTable(
  "webhook_attempts",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    deliveryId: uuid("delivery_id")
      .notNull()
      .references(() => webhookDeliveries.id, { onDelete: "cascade" }),
    attempt: integer("attempt").notNull(),
    statusCode: integer("status_code"),
    error: text("error"),
    durationMs: integer("duration_ms").notNull(),
    responseExcerpt: text("response_excerpt"),
    createdAt: createdAt(),
  },
  (t) => [index("webhook_attempts_delivery_idx").on(t.deliveryId, t.attempt)],
);
export type WebhookAttempt = typeof webhookAttempts.$inferSelect;
