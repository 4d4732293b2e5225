import { doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { FIT_STATUSES, type CostPoint, type FitInterruption, type FitOutcome, type StoredCheckpoint } from "@/lib/fits/record";
import type { FitSpec } from "@/lib/fits/spec";
import { proposals, referenceBandSets, revisions, users } from "./schema";

/* Refits: one row per fit run, which is also its permanent record (inputs, progress, outcome). */

export const fitStatus = pgEnum("fit_status", FIT_STATUSES);

export const fitRuns = pgTable(
  "fit_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    /** The revision whose parameters are the start values. */
    baseRevisionId: uuid("base_revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    referenceSetId: uuid("reference_set_id")
      .notNull()
      .references(() => referenceBandSets.id, { onDelete: "cascade" }),
    /** Set when this run repeats a stored record. */
    rerunOf: uuid("rerun_of"),
    startedBy: uuid("started_by")
      .notNull()
      .references(() => users.id),
    status: fitStatus("status").notNull().default("queued"),
    spec: jsonb("spec").$type<FitSpec>().notNull(),
    engineVersion: text("engine_version").notNull(),
    /** Worker attempts so far (a crashed worker's job is retried, a stopped worker's job handed back). */
    attempts: integer("attempts").notNull().default(0),
    /** Attempts that ended in a crash (the worker died or its thread failed): only these count against the retry limit. */
    crashes: integer("crashes").notNull().default(0),
    /** Where the fit stood at the last heartbeat: a handed-back or retried run resumes from here. */
    checkpoint: jsonb("checkpoint").$type<StoredCheckpoint | null>(),
    /** Each time a worker stopped or crashed while running it, and the iteration and best cost it resumed from. */
    interruptions: jsonb("interruptions").$type<FitInterruption[]>().notNull().default([]),
    iteration: integer("iteration").notNull().default(0),
    cost: doublePrecision("cost"),
    elapsedMs: integer("elapsed_ms").notNull().default(0),
    /** Last progress write by the worker: a heartbeat, written at least every second while running. */
    progressAt: timestamp("progress_at", { withTimezone: true }),
    costHistory: jsonb("cost_history").$type<CostPoint[]>().notNull().default([]),
    outcome: jsonb("outcome").$type<FitOutcome | null>(),
    /** The revision the outcome became, when it did. */
    resultRevisionId: uuid("result_revision_id").references(() => revisions.id, { onDelete: "set null" }),
    /** Why the outcome did not become a revision automatically. */
    applyNote: text("apply_note"),
    failureReason: text("failure_reason"),
    cancelRequestedAt: timestamp("cancel_requested_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    index("fit_runs_proposal_idx").on(t.proposalId, t.createdAt),
    index("fit_runs_started_by_idx").on(t.startedBy, t.status),
    uniqueIndex("fit_runs_result_revision_key").on(t.resultRevisionId),
  ],
);
export type FitRun = typeof fitRuns.$inferSelect;
