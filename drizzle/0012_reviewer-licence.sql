ALTER TABLE "users" ADD COLUMN "licence_number" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "licence_jurisdiction" text DEFAULT '' NOT NULL;