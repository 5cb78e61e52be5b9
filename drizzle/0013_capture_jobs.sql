CREATE TYPE "public"."capture_status" AS ENUM('queued', 'processing', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "capture_results" (
	"capture_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"fingerprint" text NOT NULL,
	"result" jsonb,
	"junction" jsonb,
	"case_trace" jsonb,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "capture_results_capture_id_part_id_pk" PRIMARY KEY("capture_id","part_id")
);
--> statement-breakpoint
ALTER TABLE "captures" ALTER COLUMN "sha256" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "captures" ALTER COLUMN "summary" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "captures" ALTER COLUMN "trace" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "captures" ADD COLUMN "status" "capture_status" DEFAULT 'done' NOT NULL;--> statement-breakpoint
ALTER TABLE "captures" ADD COLUMN "error" text;--> statement-breakpoint
ALTER TABLE "captures" ADD COLUMN "attempts" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "captures" ADD COLUMN "processed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "capture_results" ADD CONSTRAINT "capture_results_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "capture_results" ADD CONSTRAINT "capture_results_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;