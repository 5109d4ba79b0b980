CREATE TYPE "public"."site_record_condition" AS ENUM('without-damper', 'with-damper', 'damper-locked');--> statement-breakpoint
CREATE TABLE "site_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"structure_id" uuid NOT NULL,
	"mode_id" uuid,
	"condition" "site_record_condition" NOT NULL,
	"file_name" text NOT NULL,
	"file_bytes" "bytea" NOT NULL,
	"channel" text NOT NULL,
	"channel_index" integer NOT NULL,
	"channels" jsonb NOT NULL,
	"given_sample_rate_hz" double precision,
	"sample_rate_hz" double precision NOT NULL,
	"sample_count" integer NOT NULL,
	"measured_at" timestamp with time zone,
	"notes" text,
	"analysis" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "site_records_version_positive" CHECK ("site_records"."version" >= 1),
	CONSTRAINT "site_records_sample_rate_positive" CHECK ("site_records"."sample_rate_hz" > 0)
);
--> statement-breakpoint
ALTER TABLE "site_records" ADD CONSTRAINT "site_records_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_records" ADD CONSTRAINT "site_records_structure_id_structures_id_fk" FOREIGN KEY ("structure_id") REFERENCES "public"."structures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_records" ADD CONSTRAINT "site_records_mode_id_structure_modes_id_fk" FOREIGN KEY ("mode_id") REFERENCES "public"."structure_modes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_records" ADD CONSTRAINT "site_records_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "site_records_project_idx" ON "site_records" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "site_records_structure_idx" ON "site_records" USING btree ("structure_id");