CREATE TYPE "public"."catalogue_base_metal" AS ENUM('copper', 'aluminium');--> statement-breakpoint
CREATE TYPE "public"."catalogue_kind" AS ENUM('materials', 'conductors', 'coverings', 'builds');--> statement-breakpoint
CREATE TYPE "public"."catalogue_conductor_shape" AS ENUM('round', 'rectangular');--> statement-breakpoint
CREATE TYPE "public"."catalogue_covering_role" AS ENUM('insulation', 'sheath', 'coating', 'paint', 'sleeve');--> statement-breakpoint
CREATE TYPE "public"."catalogue_import_status" AS ENUM('previewed', 'committed');--> statement-breakpoint
CREATE TYPE "public"."catalogue_size_system" AS ENUM('metric', 'awg', 'kcmil', 'bar');--> statement-breakpoint
CREATE TABLE "catalogue_cable_build_layers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"build_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"covering_id" uuid NOT NULL,
	"thickness_mm" numeric NOT NULL,
	"thickness_source" text NOT NULL,
	CONSTRAINT "catalogue_layer_position" CHECK ("catalogue_cable_build_layers"."position" >= 1)
);
--> statement-breakpoint
CREATE TABLE "catalogue_cable_builds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"key" text NOT NULL,
	"name" text NOT NULL,
	"maker" text NOT NULL,
	"conductor_id" uuid NOT NULL,
	"cores" integer DEFAULT 1 NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "catalogue_cable_builds_cores" CHECK ("catalogue_cable_builds"."cores" >= 1)
);
--> statement-breakpoint
CREATE TABLE "catalogue_conductors" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"key" text NOT NULL,
	"designation" text NOT NULL,
	"material_id" uuid NOT NULL,
	"shape" "catalogue_conductor_shape" NOT NULL,
	"size_system" "catalogue_size_system" NOT NULL,
	"construction" text DEFAULT '' NOT NULL,
	"section_mm2" numeric NOT NULL,
	"r20_ohm_per_km" numeric NOT NULL,
	"resistance_source" text NOT NULL,
	"diameter_mm" numeric,
	"width_mm" numeric,
	"thickness_mm" numeric,
	"dimension_source" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "catalogue_conductors_geometry" CHECK (("catalogue_conductors"."shape" = 'round' and "catalogue_conductors"."diameter_mm" is not null) or ("catalogue_conductors"."shape" = 'rectangular' and "catalogue_conductors"."width_mm" is not null and "catalogue_conductors"."thickness_mm" is not null))
);
--> statement-breakpoint
CREATE TABLE "catalogue_coverings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"key" text NOT NULL,
	"name" text NOT NULL,
	"role" "catalogue_covering_role" NOT NULL,
	"thermal_resistivity_km_per_w" numeric NOT NULL,
	"resistivity_source" text NOT NULL,
	"continuous_limit_c" numeric,
	"short_circuit_limit_c" numeric,
	"limits_source" text NOT NULL,
	"emissivity" numeric,
	"emissivity_source" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "catalogue_imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"kind" "catalogue_kind" NOT NULL,
	"file_name" text NOT NULL,
	"media_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"content" "bytea" NOT NULL,
	"status" "catalogue_import_status" DEFAULT 'previewed' NOT NULL,
	"row_count" integer NOT NULL,
	"problems" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"committed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "catalogue_materials" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"key" text NOT NULL,
	"name" text NOT NULL,
	"base_metal" "catalogue_base_metal" NOT NULL,
	"rho20_ohm_m" numeric NOT NULL,
	"alpha20_per_k" numeric NOT NULL,
	"electrical_source" text NOT NULL,
	"thermal_conductivity_w_per_mk" numeric NOT NULL,
	"density_kg_per_m3" numeric NOT NULL,
	"specific_heat_j_per_kgk" numeric NOT NULL,
	"thermal_source" text NOT NULL,
	"adiabatic_k" numeric NOT NULL,
	"beta_k" numeric NOT NULL,
	"short_circuit_source" text NOT NULL,
	"price_per_kg" numeric,
	"price_note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "catalogue_cable_build_layers" ADD CONSTRAINT "catalogue_cable_build_layers_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_cable_build_layers" ADD CONSTRAINT "catalogue_cable_build_layers_build_id_catalogue_cable_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."catalogue_cable_builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_cable_build_layers" ADD CONSTRAINT "catalogue_cable_build_layers_covering_id_catalogue_coverings_id_fk" FOREIGN KEY ("covering_id") REFERENCES "public"."catalogue_coverings"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_cable_builds" ADD CONSTRAINT "catalogue_cable_builds_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_cable_builds" ADD CONSTRAINT "catalogue_cable_builds_conductor_id_catalogue_conductors_id_fk" FOREIGN KEY ("conductor_id") REFERENCES "public"."catalogue_conductors"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_conductors" ADD CONSTRAINT "catalogue_conductors_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_conductors" ADD CONSTRAINT "catalogue_conductors_material_id_catalogue_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."catalogue_materials"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_coverings" ADD CONSTRAINT "catalogue_coverings_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_imports" ADD CONSTRAINT "catalogue_imports_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_imports" ADD CONSTRAINT "catalogue_imports_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_materials" ADD CONSTRAINT "catalogue_materials_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_cable_build_layers_position" ON "catalogue_cable_build_layers" USING btree ("build_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_cable_builds_team_key" ON "catalogue_cable_builds" USING btree ("team_id","key");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_conductors_team_key" ON "catalogue_conductors" USING btree ("team_id","key");--> statement-breakpoint
CREATE INDEX "catalogue_conductors_material_idx" ON "catalogue_conductors" USING btree ("material_id");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_coverings_team_key" ON "catalogue_coverings" USING btree ("team_id","key");--> statement-breakpoint
CREATE INDEX "catalogue_imports_team_idx" ON "catalogue_imports" USING btree ("team_id");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_materials_team_key" ON "catalogue_materials" USING btree ("team_id","key");