ALTER TABLE "teams" ADD COLUMN "min_parallel_section_mm2" numeric;--> statement-breakpoint
ALTER TABLE "schedules" ADD COLUMN "sizing_options" jsonb DEFAULT '{}'::jsonb NOT NULL;