CREATE TYPE "public"."record_start" AS ENUM('rest', 'steady');--> statement-breakpoint
ALTER TYPE "public"."between_curves" ADD VALUE 'thermal';--> statement-breakpoint
ALTER TABLE "captures" ADD COLUMN "start" "record_start";--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "voltage_limit" double precision DEFAULT 0.8 NOT NULL;