CREATE TYPE "public"."fit_status" AS ENUM('queued', 'running', 'converged', 'not_converged', 'cancelled', 'failed');--> statement-breakpoint
CREATE TABLE "fit_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"proposal_id" uuid NOT NULL,
	"base_revision_id" uuid NOT NULL,
	"reference_set_id" uuid NOT NULL,
	"rerun_of" uuid,
	"started_by" uuid NOT NULL,
	"status" "fit_status" DEFAULT 'queued' NOT NULL,
	"spec" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"iteration" integer DEFAULT 0 NOT NULL,
	"cost" double precision,
	"elapsed_ms" integer DEFAULT 0 NOT NULL,
	"progress_at" timestamp with time zone,
	"cost_history" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"outcome" jsonb,
	"result_revision_id" uuid,
	"apply_note" text,
	"failure_reason" text,
	"cancel_requested_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "fit_runs" ADD CONSTRAINT "fit_runs_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD CONSTRAINT "fit_runs_base_revision_id_revisions_id_fk" FOREIGN KEY ("base_revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD CONSTRAINT "fit_runs_reference_set_id_reference_band_sets_id_fk" FOREIGN KEY ("reference_set_id") REFERENCES "public"."reference_band_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD CONSTRAINT "fit_runs_started_by_users_id_fk" FOREIGN KEY ("started_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD CONSTRAINT "fit_runs_result_revision_id_revisions_id_fk" FOREIGN KEY ("result_revision_id") REFERENCES "public"."revisions"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "fit_runs_proposal_idx" ON "fit_runs" USING btree ("proposal_id","created_at");--> statement-breakpoint
CREATE INDEX "fit_runs_started_by_idx" ON "fit_runs" USING btree ("started_by","status");--> statement-breakpoint
CREATE UNIQUE INDEX "fit_runs_result_revision_key" ON "fit_runs" USING btree ("result_revision_id");