import { sql } from "drizzle-orm";
import {
  bigserial,
  boolean,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { ROLES } from "@/lib/auth/roles";

export const roleEnum = pgEnum("role", ROLES);

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash"),
    roles: roleEnum("roles").array().notNull().default(sql`'{}'::role[]`),
    active: boolean("active").notNull().default(true),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("users_email_key").on(t.email)],
);
export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    roles: roleEnum("roles").array().notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_hash_key").on(t.tokenHash), index("invitations_email_idx").on(t.email)],
);
export type Invitation = typeof invitations.$inferSelect;

export const passwordResetTokens = pgTable(
  "password_reset_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("password_reset_tokens_token_hash_key").on(t.tokenHash), index("password_reset_tokens_user_idx").on(t.userId)],
);
export type PasswordResetToken = typeof passwordResetTokens.$inferSelect;

/** Append-only: a trigger in the migrations refuses UPDATE and DELETE. */
export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    actorId: uuid("actor_id").references(() => users.id),
    action: text("action").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: text("subject_id"),
    before: jsonb("before").$type<Record<string, unknown> | null>(),
    after: jsonb("after").$type<Record<string, unknown> | null>(),
    createdAt: createdAt(),
  },
  (t) => [index("audit_events_subject_idx").on(t.subjectType, t.subjectId), index("audit_events_created_idx").on(t.createdAt)],
);
export type AuditEvent = typeof auditEvents.$inferSelect;
export type NewAuditEvent = typeof auditEvents.$inferInsert;

export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    email: text("email").notNull(),
    ip: text("ip").notNull(),
    succeeded: boolean("succeeded").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("sign_in_attempts_email_idx").on(t.email, t.createdAt), index("sign_in_attempts_ip_idx").on(t.ip, t.createdAt)],
);

/** Messages stored by the local mail catcher (dev and tests only). */
export const caughtMail = pgTable(
  "caught_mail",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    sender: text("sender").notNull(),
    recipients: text("recipients").array().notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body"),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("caught_mail_received_idx").on(t.receivedAt)],
);
export type CaughtMail = typeof caughtMail.$inferSelect;

export const modelFamilies = pgTable(
  "model_families",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    slug: text("slug").notNull(),
    title: text("title").notNull(),
    description: text("description").notNull(),
    dimension: integer("dimension").notNull(),
    isDemo: boolean("is_demo").notNull().default(false),
    /** Working parameter set the family starts from until it has releases. */
    startingDocument: jsonb("starting_document").$type<unknown>(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("model_families_slug_key").on(t.slug)],
);
export type ModelFamily = typeof modelFamilies.$inferSelect;
