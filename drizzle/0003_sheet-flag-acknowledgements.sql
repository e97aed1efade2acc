CREATE TABLE "sheet_flag_acknowledgements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"sheet_id" uuid NOT NULL,
	"flag_code" text NOT NULL,
	"comment" text NOT NULL,
	"reviewer_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "sheet_flag_acknowledgements" ADD CONSTRAINT "sheet_flag_acknowledgements_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_flag_acknowledgements" ADD CONSTRAINT "sheet_flag_acknowledgements_sheet_id_sheets_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_flag_acknowledgements" ADD CONSTRAINT "sheet_flag_acknowledgements_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "sheet_flag_ack_unique" ON "sheet_flag_acknowledgements" USING btree ("sheet_id","flag_code");--> statement-breakpoint
CREATE INDEX "sheet_flag_ack_team_idx" ON "sheet_flag_acknowledgements" USING btree ("team_id");