CREATE TYPE "public"."comfort_criteria_status" AS ENUM('draft', 'submitted', 'approved', 'returned');--> statement-breakpoint
CREATE TYPE "public"."mode_direction" AS ENUM('vertical', 'lateral', 'longitudinal', 'torsional');--> statement-breakpoint
CREATE TYPE "public"."structure_kind" AS ENUM('footbridge-span', 'floor-bay');--> statement-breakpoint
CREATE TABLE "comfort_criteria" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"spec" jsonb NOT NULL,
	"status" "comfort_criteria_status" DEFAULT 'draft' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "comfort_criteria_name_not_blank" CHECK (length(trim("comfort_criteria"."name")) > 0),
	CONSTRAINT "comfort_criteria_version_positive" CHECK ("comfort_criteria"."version" >= 1),
	CONSTRAINT "comfort_criteria_spec_set" CHECK (jsonb_typeof("comfort_criteria"."spec"->'set') = 'string')
);
--> statement-breakpoint
CREATE TABLE "load_cases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"spec" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "load_cases_name_not_blank" CHECK (length(trim("load_cases"."name")) > 0),
	CONSTRAINT "load_cases_version_positive" CHECK ("load_cases"."version" >= 1),
	CONSTRAINT "load_cases_spec_kind" CHECK (jsonb_typeof("load_cases"."spec"->'kind') = 'string')
);
--> statement-breakpoint
CREATE TABLE "lumped_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"structure_id" uuid NOT NULL,
	"name" text NOT NULL,
	"mass_matrix_kg" jsonb NOT NULL,
	"stiffness_matrix_n_per_m" jsonb NOT NULL,
	"dof_labels" jsonb,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lumped_models_structure_id_unique" UNIQUE("structure_id","id"),
	CONSTRAINT "lumped_models_name_not_blank" CHECK (length(trim("lumped_models"."name")) > 0),
	CONSTRAINT "lumped_models_version_positive" CHECK ("lumped_models"."version" >= 1),
	CONSTRAINT "lumped_models_matrices_are_arrays" CHECK (jsonb_typeof("lumped_models"."mass_matrix_kg") = 'array' and jsonb_typeof("lumped_models"."stiffness_matrix_n_per_m") = 'array')
);
--> statement-breakpoint
CREATE TABLE "structure_modes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"structure_id" uuid NOT NULL,
	"label" text NOT NULL,
	"direction" "mode_direction" NOT NULL,
	"frequency_hz" double precision NOT NULL,
	"modal_mass_kg" double precision NOT NULL,
	"damping_ratio" double precision NOT NULL,
	"mode_shape_mean" double precision,
	"source" jsonb DEFAULT '{"kind":"typed"}'::jsonb NOT NULL,
	"lumped_model_id" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "structure_modes_label_not_blank" CHECK (length(trim("structure_modes"."label")) > 0),
	CONSTRAINT "structure_modes_version_positive" CHECK ("structure_modes"."version" >= 1),
	CONSTRAINT "structure_modes_frequency_positive" CHECK ("structure_modes"."frequency_hz" > 0),
	CONSTRAINT "structure_modes_modal_mass_positive" CHECK ("structure_modes"."modal_mass_kg" > 0),
	CONSTRAINT "structure_modes_damping_ratio_range" CHECK ("structure_modes"."damping_ratio" >= 0 and "structure_modes"."damping_ratio" < 1),
	CONSTRAINT "structure_modes_mode_shape_mean_range" CHECK ("structure_modes"."mode_shape_mean" is null or ("structure_modes"."mode_shape_mean" > 0 and "structure_modes"."mode_shape_mean" <= 1)),
	CONSTRAINT "structure_modes_source_kind" CHECK ("structure_modes"."source"->>'kind' in ('typed', 'beam', 'lumped-model')),
	CONSTRAINT "structure_modes_lumped_model_matches_source" CHECK (("structure_modes"."source"->>'kind' = 'lumped-model') = ("structure_modes"."lumped_model_id" is not null) and ("structure_modes"."lumped_model_id" is null or "structure_modes"."lumped_model_id"::text = "structure_modes"."source"->>'modelId'))
);
--> statement-breakpoint
CREATE TABLE "structures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" "structure_kind" NOT NULL,
	"span_m" double precision,
	"width_m" double precision,
	"deck_area_m2" double precision,
	"notes" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "structures_name_not_blank" CHECK (length(trim("structures"."name")) > 0),
	CONSTRAINT "structures_version_positive" CHECK ("structures"."version" >= 1),
	CONSTRAINT "structures_dimensions_positive" CHECK (coalesce("structures"."span_m", 1) > 0 and coalesce("structures"."width_m", 1) > 0 and coalesce("structures"."deck_area_m2", 1) > 0)
);
--> statement-breakpoint
ALTER TABLE "comfort_criteria" ADD CONSTRAINT "comfort_criteria_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comfort_criteria" ADD CONSTRAINT "comfort_criteria_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_cases" ADD CONSTRAINT "load_cases_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_cases" ADD CONSTRAINT "load_cases_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lumped_models" ADD CONSTRAINT "lumped_models_structure_id_structures_id_fk" FOREIGN KEY ("structure_id") REFERENCES "public"."structures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lumped_models" ADD CONSTRAINT "lumped_models_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structure_modes" ADD CONSTRAINT "structure_modes_structure_id_structures_id_fk" FOREIGN KEY ("structure_id") REFERENCES "public"."structures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structure_modes" ADD CONSTRAINT "structure_modes_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structure_modes" ADD CONSTRAINT "structure_modes_lumped_model_fk" FOREIGN KEY ("structure_id","lumped_model_id") REFERENCES "public"."lumped_models"("structure_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "comfort_criteria_project_idx" ON "comfort_criteria" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "load_cases_project_idx" ON "load_cases" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "lumped_models_structure_idx" ON "lumped_models" USING btree ("structure_id");--> statement-breakpoint
CREATE INDEX "structure_modes_structure_idx" ON "structure_modes" USING btree ("structure_id");--> statement-breakpoint
CREATE INDEX "structure_modes_lumped_model_idx" ON "structure_modes" USING btree ("lumped_model_id");--> statement-breakpoint
CREATE INDEX "structures_project_idx" ON "structures" USING btree ("project_id");