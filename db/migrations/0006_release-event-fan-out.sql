ALTER TABLE "release_events" ADD COLUMN "fanned_out_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "release_events_unsent_idx" ON "release_events" USING btree ("created_at") WHERE fanned_out_at is null;--> statement-breakpoint
-- Events recorded before this column existed were handed to the queue when they happened; do not send them again.
UPDATE "release_events" SET "fanned_out_at" = "created_at" WHERE "fanned_out_at" IS NULL;
