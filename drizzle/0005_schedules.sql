CREATE TYPE "public"."schedule_row_status" AS ENUM('pending', 'sized', 'none_passes');--> statement-breakpoint
CREATE TYPE "public"."schedule_status" AS ENUM('draft', 'queued', 'done');--> statement-breakpoint
CREATE TABLE "schedule_rows" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"schedule_id" uuid NOT NULL,
	"row_number" integer NOT NULL,
	"circuit_tag" text NOT NULL,
	"input" jsonb NOT NULL,
	"status" "schedule_row_status" DEFAULT 'pending' NOT NULL,
	"result" jsonb,
	"solver_ms" double precision,
	"sized_by" text,
	"sized_at" timestamp with time zone,
	CONSTRAINT "schedule_rows_row_number" CHECK ("schedule_rows"."row_number" >= 2),
	CONSTRAINT "schedule_rows_result_when_sized" CHECK (("schedule_rows"."status" = 'pending') = ("schedule_rows"."result" is null))
);
--> statement-breakpoint
CREATE TABLE "schedules" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"status" "schedule_status" DEFAULT 'draft' NOT NULL,
	"file_name" text,
	"media_type" text,
	"size_bytes" integer,
	"content" "bytea",
	"preview_rows" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"problems" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"file_row_count" integer DEFAULT 0 NOT NULL,
	"families" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"row_count" integer DEFAULT 0 NOT NULL,
	"dropped_rows" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"solver_version" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"queued_at" timestamp with time zone,
	"completed_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "schedule_rows" ADD CONSTRAINT "schedule_rows_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_rows" ADD CONSTRAINT "schedule_rows_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedules" ADD CONSTRAINT "schedules_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "schedule_rows_schedule_row_unique" ON "schedule_rows" USING btree ("schedule_id","row_number");--> statement-breakpoint
CREATE INDEX "schedule_rows_team_idx" ON "schedule_rows" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "schedules_team_idx" ON "schedules" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "schedules_project_idx" ON "schedules" USING btree ("project_id");