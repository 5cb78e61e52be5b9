ALTER TABLE "parts" ADD COLUMN "transfer" jsonb;--> statement-breakpoint
ALTER TABLE "parts" ADD COLUMN "avalanche_energy" double precision;--> statement-breakpoint
ALTER TABLE "parts" ADD COLUMN "avalanche_current" double precision;--> statement-breakpoint
ALTER TABLE "parts" ADD COLUMN "avalanche_breakdown" double precision;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "case_network" jsonb;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "apply_case_network" boolean DEFAULT false NOT NULL;