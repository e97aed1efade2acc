CREATE TYPE "public"."sheet_contribution" AS ENUM('edited', 'submitted');--> statement-breakpoint
CREATE TABLE "revoked_sessions" (
	"session_id" uuid PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"revoked_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sheet_contributions" (
	"team_id" uuid NOT NULL,
	"sheet_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"kind" "sheet_contribution" NOT NULL,
	"first_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revoked_sessions" ADD CONSTRAINT "revoked_sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_contributions" ADD CONSTRAINT "sheet_contributions_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_contributions" ADD CONSTRAINT "sheet_contributions_sheet_id_sheets_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_contributions" ADD CONSTRAINT "sheet_contributions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revoked_sessions_expires_idx" ON "revoked_sessions" USING btree ("expires_at");--> statement-breakpoint
CREATE UNIQUE INDEX "sheet_contributions_unique" ON "sheet_contributions" USING btree ("sheet_id","user_id","kind");--> statement-breakpoint
CREATE INDEX "sheet_contributions_team_idx" ON "sheet_contributions" USING btree ("team_id");--> statement-breakpoint
-- Backfill: the author edited every existing revision; the audit log says who else saved or submitted it.
INSERT INTO "sheet_contributions" ("team_id", "sheet_id", "user_id", "kind", "first_at", "last_at")
SELECT s."team_id", s."id", s."author_id", 'edited', s."created_at", s."updated_at" FROM "sheets" s
ON CONFLICT DO NOTHING;--> statement-breakpoint
INSERT INTO "sheet_contributions" ("team_id", "sheet_id", "user_id", "kind", "first_at", "last_at")
SELECT s."team_id", s."id", a."actor_id", CASE WHEN a."action" = 'sheet.submit' THEN 'submitted'::"sheet_contribution" ELSE 'edited'::"sheet_contribution" END, min(a."at"), max(a."at")
FROM "audit_log" a
JOIN "sheets" s ON s."id"::text = a."entity_id" AND s."team_id" = a."team_id"
JOIN "users" u ON u."id" = a."actor_id"
WHERE a."entity" = 'sheet' AND a."action" IN ('sheet.save', 'sheet.submit')
GROUP BY s."team_id", s."id", a."actor_id", CASE WHEN a."action" = 'sheet.submit' THEN 'submitted'::"sheet_contribution" ELSE 'edited'::"sheet_contribution" END
ON CONFLICT DO NOTHING;
