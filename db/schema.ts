import { sql } from "drizzle-orm";
import {
  type AnyPgColumn,
  bigserial,
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { STAGES, VERDICTS } from "@/board/stages";
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
    /** Copied into each session token at sign-in; bumping it ends every earlier session (lib/auth/guard.ts). */
    sessionVersion: integer("session_version").notNull().default(1),
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
    /** Where the request came from (proxy-reported), for the per-address cap on reset mail. */
    requestedIp: text("requested_ip"),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("password_reset_tokens_token_hash_key").on(t.tokenHash),
    index("password_reset_tokens_user_idx").on(t.userId),
    index("password_reset_tokens_ip_idx").on(t.requestedIp, t.createdAt),
  ],
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

/**
 * Sign-in attempts per account ("account", e-mail) and per client address ("address") in a window that opens with
 * the first attempt; reserved atomically before a password is checked (lib/accounts/sign-in-counters.ts).
 */
export const signInCounters = pgTable(
  "sign_in_counters",
  {
    scope: text("scope").notNull(),
    key: text("key").notNull(),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull().defaultNow(),
    attempts: integer("attempts").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.scope, t.key] }), index("sign_in_counters_window_idx").on(t.windowStart)],
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
    /** Acceptance criteria as data (lib/tb/analysis/acceptance.ts), evaluated on every revision. */
    acceptanceCriteria: jsonb("acceptance_criteria").$type<unknown[]>().notNull().default([]),
    requiredAccepts: integer("required_accepts").notNull().default(2),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("model_families_slug_key").on(t.slug)],
);
export type ModelFamily = typeof modelFamilies.$inferSelect;

export const familyCurators = pgTable(
  "family_curators",
  {
    familyId: uuid("family_id")
      .notNull()
      .references(() => modelFamilies.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.familyId, t.userId] })],
);

export const stageEnum = pgEnum("proposal_stage", STAGES);
export const verdictEnum = pgEnum("verdict", VERDICTS);
export const remarkStatusEnum = pgEnum("remark_status", ["open", "addressed", "resolved"]);

/** Published, immutable model documents; filled by the release use-case. */
export const releases = pgTable(
  "releases",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    familyId: uuid("family_id")
      .notNull()
      .references(() => modelFamilies.id),
    version: text("version").notNull(),
    document: jsonb("document").$type<unknown>().notNull(),
    sha256: text("sha256").notNull(),
    physicsHash: text("physics_hash").notNull(),
    changelog: text("changelog").notNull(),
    proposalId: uuid("proposal_id").references((): AnyPgColumn => proposals.id),
    releasedBy: uuid("released_by").references(() => users.id),
    createdAt: createdAt(),
    /** Deprecation and withdrawal are the only changes a release accepts (a trigger guards the rest). */
    deprecatedAt: timestamp("deprecated_at", { withTimezone: true }),
    deprecationReason: text("deprecation_reason"),
    successorId: uuid("successor_id").references((): AnyPgColumn => releases.id),
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawalReason: text("withdrawal_reason"),
  },
  (t) => [uniqueIndex("releases_family_version_key").on(t.familyId, t.version), index("releases_family_idx").on(t.familyId, t.createdAt)],
);
export type Release = typeof releases.$inferSelect;

export const proposals = pgTable(
  "proposals",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    familyId: uuid("family_id")
      .notNull()
      .references(() => modelFamilies.id),
    baseReleaseId: uuid("base_release_id").references((): AnyPgColumn => releases.id),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id),
    title: text("title").notNull(),
    rationale: text("rationale").notNull().default(""),
    stage: stageEnum("stage").notNull().default("draft"),
    /** Optimistic concurrency: every change bumps it; a write based on an older value gets a conflict. */
    version: integer("version").notNull().default(1),
    revisionWhenReturned: integer("revision_when_returned"),
    stageChangedAt: timestamp("stage_changed_at", { withTimezone: true }).notNull().defaultNow(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("proposals_stage_idx").on(t.stage, t.updatedAt), index("proposals_family_idx").on(t.familyId), index("proposals_author_idx").on(t.authorId)],
);
export type Proposal = typeof proposals.$inferSelect;

export const revisions = pgTable(
  "revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    document: jsonb("document").$type<unknown>().notNull(),
    sha256: text("sha256").notNull(),
    physicsHash: text("physics_hash").notNull(),
    note: text("note").notNull().default(""),
    checkResults: jsonb("check_results").$type<unknown[]>().notNull(),
    checksPassing: boolean("checks_passing").notNull(),
    checksWaivedReason: text("checks_waived_reason"),
    checksWaivedBy: uuid("checks_waived_by").references(() => users.id),
    /** Largest |ΔE| against the base along the default path, downsampled for the card sparkline (eV). */
    shiftProfile: jsonb("shift_profile").$type<number[] | null>(),
    maxShift: doublePrecision("max_shift"),
    createdBy: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("revisions_proposal_number_key").on(t.proposalId, t.number)],
);
export type Revision = typeof revisions.$inferSelect;

export const referenceBandSets = pgTable(
  "reference_band_sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    fileName: text("file_name").notNull(),
    content: text("content").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    /** Parsed energies in eV with their k coordinates, as validated at upload. */
    parsed: jsonb("parsed").$type<unknown>().notNull(),
    provenance: jsonb("provenance").$type<Record<string, string | undefined>>().notNull(),
    uploadedBy: uuid("uploaded_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("reference_band_sets_proposal_idx").on(t.proposalId)],
);
export type ReferenceBandSet = typeof referenceBandSets.$inferSelect;

export const reviewerAssignments = pgTable(
  "reviewer_assignments",
  {
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    reviewerId: uuid("reviewer_id")
      .notNull()
      .references(() => users.id),
    assignedBy: uuid("assigned_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.proposalId, t.reviewerId] }), index("reviewer_assignments_reviewer_idx").on(t.reviewerId)],
);

export const verdicts = pgTable(
  "verdicts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    reviewerId: uuid("reviewer_id")
      .notNull()
      .references(() => users.id),
    verdict: verdictEnum("verdict").notNull(),
    summary: text("summary").notNull(),
    /** Physics hash of the revision judged: the verdict is fresh while the latest revision has the same one. */
    physicsHash: text("physics_hash").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("verdicts_proposal_idx").on(t.proposalId)],
);
export type VerdictRow = typeof verdicts.$inferSelect;

export const remarks = pgTable(
  "remarks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id),
    parentId: uuid("parent_id").references((): AnyPgColumn => remarks.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    blocking: boolean("blocking").notNull().default(false),
    /** Where it points: a parameter key, a k-range of the band plot, or the proposal as a whole. */
    anchor: jsonb("anchor").$type<Record<string, unknown>>().notNull().default({ kind: "proposal" }),
    status: remarkStatusEnum("status").notNull().default("open"),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("remarks_proposal_idx").on(t.proposalId, t.status)],
);
export type Remark = typeof remarks.$inferSelect;

export * from "./schema-registry";
export * from "./schema-fits";
export * from "./schema-markdown";
