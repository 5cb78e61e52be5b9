CREATE TYPE "public"."between_curves" AS ENUM('loglog', 'next-longer');--> statement-breakpoint
CREATE TYPE "public"."pulse_kind" AS ENUM('rect', 'triangle');--> statement-breakpoint
CREATE TABLE "captures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"object_key" text NOT NULL,
	"samples_key" text NOT NULL,
	"file_name" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"trace" jsonb NOT NULL,
	"note" text,
	"board_serial" text,
	"probe" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "captures_objectKey_unique" UNIQUE("object_key"),
	CONSTRAINT "captures_samplesKey_unique" UNIQUE("samples_key")
);
--> statement-breakpoint
CREATE TABLE "fault_cases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" "pulse_kind" NOT NULL,
	"v" double precision NOT NULL,
	"i" double precision NOT NULL,
	"duration" double precision NOT NULL,
	"repeat_period" double precision,
	"repeat_count" integer,
	"case_temp" double precision,
	"origin" jsonb,
	"notes" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measured_pulses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"label" text NOT NULL,
	"kind" "pulse_kind" NOT NULL,
	"v" double precision NOT NULL,
	"i" double precision NOT NULL,
	"duration" double precision NOT NULL,
	"repeat_period" double precision,
	"repeat_count" integer,
	"note" text,
	"board_serial" text,
	"probe" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"subject_type" text NOT NULL,
	"subject_id" uuid NOT NULL,
	"recipient_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "project_candidates" (
	"project_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"added_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "project_candidates_project_id_part_id_pk" PRIMARY KEY("project_id","part_id")
);
--> statement-breakpoint
CREATE TABLE "projects" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"name" text NOT NULL,
	"description" text,
	"case_temp" double precision DEFAULT 25 NOT NULL,
	"utilisation_limit" double precision DEFAULT 0.8 NOT NULL,
	"tj_guard" double precision DEFAULT 25 NOT NULL,
	"between_curves" "between_curves" DEFAULT 'loglog' NOT NULL,
	"owner_id" uuid,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fault_cases" ADD CONSTRAINT "fault_cases_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fault_cases" ADD CONSTRAINT "fault_cases_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measured_pulses" ADD CONSTRAINT "measured_pulses_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measured_pulses" ADD CONSTRAINT "measured_pulses_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notices" ADD CONSTRAINT "notices_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notices" ADD CONSTRAINT "notices_recipient_id_users_id_fk" FOREIGN KEY ("recipient_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_candidates" ADD CONSTRAINT "project_candidates_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_candidates" ADD CONSTRAINT "project_candidates_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "projects" ADD CONSTRAINT "projects_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "projects" ADD CONSTRAINT "projects_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "captures_project_id_index" ON "captures" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "fault_cases_project_id_index" ON "fault_cases" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "measured_pulses_project_id_index" ON "measured_pulses" USING btree ("project_id");--> statement-breakpoint
CREATE UNIQUE INDEX "notices_subject_type_subject_id_index" ON "notices" USING btree ("subject_type","subject_id");--> statement-breakpoint
CREATE INDEX "projects_workspace_id_index" ON "projects" USING btree ("workspace_id");