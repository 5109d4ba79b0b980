CREATE TABLE "as_built_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"sign_off_id" uuid NOT NULL,
	"units" jsonb NOT NULL,
	"note" text,
	"recorded_by" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "as_built_records_units_listed" CHECK (jsonb_typeof("as_built_records"."units") = 'array' and jsonb_array_length("as_built_records"."units") >= 1)
);
--> statement-breakpoint
ALTER TABLE "as_built_records" ADD CONSTRAINT "as_built_records_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_built_records" ADD CONSTRAINT "as_built_records_sign_off_id_sign_offs_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_offs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "as_built_records" ADD CONSTRAINT "as_built_records_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "as_built_records_sign_off_idx" ON "as_built_records" USING btree ("sign_off_id","recorded_at");--> statement-breakpoint
CREATE INDEX "as_built_records_project_idx" ON "as_built_records" USING btree ("project_id");