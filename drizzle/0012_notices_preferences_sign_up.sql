CREATE TABLE "pending_sign_ups" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"workspace_name" text NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "pending_sign_ups_tokenHash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
DROP INDEX "notices_subject_type_subject_id_index";--> statement-breakpoint
ALTER TABLE "notices" ADD COLUMN "fingerprint" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "notice_failing_evidence" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "notice_decision_drift" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "notice_verification_lapsed" boolean DEFAULT true NOT NULL;--> statement-breakpoint
CREATE INDEX "pending_sign_ups_expires_at_index" ON "pending_sign_ups" USING btree ("expires_at");--> statement-breakpoint
CREATE UNIQUE INDEX "notices_subject_fingerprint_idx" ON "notices" USING btree ("subject_type","subject_id","fingerprint");