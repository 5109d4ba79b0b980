CREATE TYPE "public"."unit_system" AS ENUM('si', 'us-customary');--> statement-breakpoint
CREATE TABLE "tuning_variant_load_cases" (
	"variant_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"load_case_id" uuid NOT NULL,
	CONSTRAINT "tuning_variant_load_cases_pk" PRIMARY KEY("variant_id","position"),
	CONSTRAINT "tuning_variant_load_cases_once" UNIQUE("variant_id","load_case_id"),
	CONSTRAINT "tuning_variant_load_cases_position" CHECK ("tuning_variant_load_cases"."position" >= 0)
);
--> statement-breakpoint
CREATE TABLE "tuning_variants" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"mode_id" uuid NOT NULL,
	"criteria_id" uuid NOT NULL,
	"mass_ratio" double precision NOT NULL,
	"tuning" jsonb NOT NULL,
	"unit_count" integer DEFAULT 1 NOT NULL,
	"structure_frequency_tolerance_ratio" double precision DEFAULT 0.1 NOT NULL,
	"tmd_damping_tolerance_ratio" double precision,
	"hardware" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"notes" text,
	"result" jsonb,
	"result_error" jsonb,
	"inputs_hash" text,
	"engine_version" text,
	"computed_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tuning_variants_name_not_blank" CHECK (length(trim("tuning_variants"."name")) > 0),
	CONSTRAINT "tuning_variants_version_positive" CHECK ("tuning_variants"."version" >= 1),
	CONSTRAINT "tuning_variants_mass_ratio_range" CHECK ("tuning_variants"."mass_ratio" > 0 and "tuning_variants"."mass_ratio" <= 0.25),
	CONSTRAINT "tuning_variants_unit_count_range" CHECK ("tuning_variants"."unit_count" between 1 and 100),
	CONSTRAINT "tuning_variants_tolerance_range" CHECK ("tuning_variants"."structure_frequency_tolerance_ratio" >= 0 and "tuning_variants"."structure_frequency_tolerance_ratio" <= 0.5),
	CONSTRAINT "tuning_variants_damping_tolerance_range" CHECK ("tuning_variants"."tmd_damping_tolerance_ratio" is null or ("tuning_variants"."tmd_damping_tolerance_ratio" >= 0 and "tuning_variants"."tmd_damping_tolerance_ratio" <= 0.9)),
	CONSTRAINT "tuning_variants_tuning_is_object" CHECK (jsonb_typeof("tuning_variants"."tuning") = 'object')
);
--> statement-breakpoint
CREATE TABLE "user_preferences" (
	"user_id" uuid PRIMARY KEY NOT NULL,
	"unit_system" "unit_system" DEFAULT 'si' NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "tuning_variant_load_cases" ADD CONSTRAINT "tuning_variant_load_cases_variant_id_tuning_variants_id_fk" FOREIGN KEY ("variant_id") REFERENCES "public"."tuning_variants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_variant_load_cases" ADD CONSTRAINT "tuning_variant_load_cases_load_case_id_load_cases_id_fk" FOREIGN KEY ("load_case_id") REFERENCES "public"."load_cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_variants" ADD CONSTRAINT "tuning_variants_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_variants" ADD CONSTRAINT "tuning_variants_mode_id_structure_modes_id_fk" FOREIGN KEY ("mode_id") REFERENCES "public"."structure_modes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_variants" ADD CONSTRAINT "tuning_variants_criteria_id_comfort_criteria_id_fk" FOREIGN KEY ("criteria_id") REFERENCES "public"."comfort_criteria"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_variants" ADD CONSTRAINT "tuning_variants_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_preferences" ADD CONSTRAINT "user_preferences_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tuning_variant_load_cases_load_case_idx" ON "tuning_variant_load_cases" USING btree ("load_case_id");--> statement-breakpoint
CREATE INDEX "tuning_variants_project_idx" ON "tuning_variants" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "tuning_variants_mode_idx" ON "tuning_variants" USING btree ("mode_id");--> statement-breakpoint
CREATE INDEX "tuning_variants_criteria_idx" ON "tuning_variants" USING btree ("criteria_id");