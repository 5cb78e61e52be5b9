CREATE TYPE "public"."part_status" AS ENUM('draft', 'verified');--> statement-breakpoint
CREATE TYPE "public"."part_technology" AS ENUM('si-mosfet', 'sic-mosfet', 'gan-hemt', 'igbt');--> statement-breakpoint
CREATE TABLE "curve_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"shape" text NOT NULL,
	"ref_case_temp" double precision DEFAULT 25 NOT NULL,
	"active" boolean DEFAULT false NOT NULL,
	"findings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "curve_sets_objectKey_unique" UNIQUE("object_key")
);
--> statement-breakpoint
CREATE TABLE "curves" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"curve_set_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"duration" double precision,
	"points" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "parts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"part_number" text NOT NULL,
	"maker" text NOT NULL,
	"technology" "part_technology" NOT NULL,
	"package" text NOT NULL,
	"vds_max" double precision NOT NULL,
	"id_max" double precision,
	"id_pulse_max" double precision,
	"rds_on" double precision,
	"tj_max" double precision NOT NULL,
	"rth_jc" double precision,
	"foster" jsonb,
	"thermal_source" jsonb,
	"unit_cost" double precision,
	"currency" text,
	"datasheet_revision" text,
	"notes" text,
	"status" "part_status" DEFAULT 'draft' NOT NULL,
	"verified_by" uuid,
	"verified_at" timestamp with time zone,
	"archived_at" timestamp with time zone,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pending_uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"user_id" uuid,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"purpose" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "pending_uploads_objectKey_unique" UNIQUE("object_key")
);
--> statement-breakpoint
ALTER TABLE "curve_sets" ADD CONSTRAINT "curve_sets_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curve_sets" ADD CONSTRAINT "curve_sets_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curve_sets" ADD CONSTRAINT "curve_sets_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curves" ADD CONSTRAINT "curves_curve_set_id_curve_sets_id_fk" FOREIGN KEY ("curve_set_id") REFERENCES "public"."curve_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts" ADD CONSTRAINT "parts_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts" ADD CONSTRAINT "parts_verified_by_users_id_fk" FOREIGN KEY ("verified_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts" ADD CONSTRAINT "parts_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pending_uploads" ADD CONSTRAINT "pending_uploads_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pending_uploads" ADD CONSTRAINT "pending_uploads_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "curve_sets_part_id_index" ON "curve_sets" USING btree ("part_id");--> statement-breakpoint
CREATE INDEX "curves_curve_set_id_index" ON "curves" USING btree ("curve_set_id");--> statement-breakpoint
CREATE UNIQUE INDEX "parts_workspace_id_maker_part_number_index" ON "parts" USING btree ("workspace_id","maker","part_number");--> statement-breakpoint
CREATE INDEX "parts_workspace_id_part_number_index" ON "parts" USING btree ("workspace_id","part_number");