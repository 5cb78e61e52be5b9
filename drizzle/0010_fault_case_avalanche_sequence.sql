CREATE TYPE "public"."fault_case_kind" AS ENUM('rect', 'triangle', 'avalanche', 'waveform');--> statement-breakpoint
ALTER TABLE "fault_cases" ALTER COLUMN "kind" SET DATA TYPE "public"."fault_case_kind" USING "kind"::text::"public"."fault_case_kind";--> statement-breakpoint
ALTER TABLE "fault_cases" ALTER COLUMN "duration" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "fault_cases" ADD COLUMN "inductance" double precision;--> statement-breakpoint
ALTER TABLE "fault_cases" ADD COLUMN "samples" jsonb;--> statement-breakpoint
ALTER TABLE "fault_cases" ADD CONSTRAINT "fault_cases_shape" CHECK (("fault_cases"."kind" in ('rect', 'triangle') and "fault_cases"."duration" is not null and "fault_cases"."inductance" is null and "fault_cases"."samples" is null)
        or ("fault_cases"."kind" = 'avalanche' and "fault_cases"."inductance" is not null and "fault_cases"."duration" is null and "fault_cases"."samples" is null and "fault_cases"."repeat_period" is null)
        or ("fault_cases"."kind" = 'waveform' and "fault_cases"."samples" is not null and "fault_cases"."duration" is null and "fault_cases"."inductance" is null and "fault_cases"."repeat_period" is null));