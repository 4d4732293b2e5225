ALTER TABLE "fit_runs" ADD COLUMN "crashes" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD COLUMN "checkpoint" jsonb;--> statement-breakpoint
ALTER TABLE "fit_runs" ADD COLUMN "interruptions" jsonb DEFAULT '[]'::jsonb NOT NULL;