ALTER TABLE "teams" ADD COLUMN "currency" text DEFAULT 'EUR' NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "decimal_separator" text;--> statement-breakpoint
ALTER TABLE "teams" ADD CONSTRAINT "teams_currency_iso" CHECK ("teams"."currency" ~ '^[A-Z]{3}$');--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_decimal_separator" CHECK ("users"."decimal_separator" is null or "users"."decimal_separator" in ('.', ','));