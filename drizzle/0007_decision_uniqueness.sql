ALTER TABLE "decisions" ADD COLUMN "idempotency_key" text;--> statement-breakpoint
CREATE UNIQUE INDEX "decisions_one_standing_per_project" ON "decisions" USING btree ("project_id") WHERE "decisions"."superseded_by" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "decisions_project_id_idempotency_key_index" ON "decisions" USING btree ("project_id","idempotency_key");