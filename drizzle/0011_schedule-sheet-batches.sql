CREATE TYPE "public"."schedule_sheet_batch_status" AS ENUM('queued', 'done');--> statement-breakpoint
CREATE TABLE "schedule_sheet_batch_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"batch_id" uuid NOT NULL,
	"row_number" integer NOT NULL,
	"sheet_id" uuid,
	"error" text,
	"done_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "schedule_sheet_batches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"schedule_id" uuid NOT NULL,
	"requested_by" uuid,
	"status" "schedule_sheet_batch_status" DEFAULT 'queued' NOT NULL,
	"total" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"completed_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "schedule_sheet_batch_items" ADD CONSTRAINT "schedule_sheet_batch_items_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_sheet_batch_items" ADD CONSTRAINT "schedule_sheet_batch_items_batch_id_schedule_sheet_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."schedule_sheet_batches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_sheet_batch_items" ADD CONSTRAINT "schedule_sheet_batch_items_sheet_id_sheets_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheets"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_sheet_batches" ADD CONSTRAINT "schedule_sheet_batches_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_sheet_batches" ADD CONSTRAINT "schedule_sheet_batches_schedule_id_schedules_id_fk" FOREIGN KEY ("schedule_id") REFERENCES "public"."schedules"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_sheet_batches" ADD CONSTRAINT "schedule_sheet_batches_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "schedule_sheet_batch_items_row_unique" ON "schedule_sheet_batch_items" USING btree ("batch_id","row_number");--> statement-breakpoint
CREATE INDEX "schedule_sheet_batch_items_team_idx" ON "schedule_sheet_batch_items" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "schedule_sheet_batches_team_schedule_idx" ON "schedule_sheet_batches" USING btree ("team_id","schedule_id");