CREATE TYPE "public"."mail_state" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."sign_off_status" AS ENUM('submitted', 'approved', 'returned');--> statement-breakpoint
CREATE TABLE "outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sign_off_id" uuid,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"text_body" text NOT NULL,
	"html_body" text,
	"state" "mail_state" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "outbox_attempts" CHECK ("outbox"."attempts" >= 0)
);
--> statement-breakpoint
CREATE TABLE "sign_offs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"variant_id" uuid NOT NULL,
	"criteria_id" uuid NOT NULL,
	"status" "sign_off_status" DEFAULT 'submitted' NOT NULL,
	"message" text,
	"submitted_by" uuid,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"decided_by" uuid,
	"decided_at" timestamp with time zone,
	"decision_comment" text,
	"snapshot" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sign_offs_decided" CHECK (("sign_offs"."status" = 'submitted') = ("sign_offs"."decided_at" is null)),
	CONSTRAINT "sign_offs_return_comment" CHECK ("sign_offs"."status" <> 'returned' or length(trim(coalesce("sign_offs"."decision_comment", ''))) > 0),
	CONSTRAINT "sign_offs_version_positive" CHECK ("sign_offs"."version" >= 1)
);
--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_sign_off_id_sign_offs_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_offs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_variant_id_tuning_variants_id_fk" FOREIGN KEY ("variant_id") REFERENCES "public"."tuning_variants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_criteria_id_comfort_criteria_id_fk" FOREIGN KEY ("criteria_id") REFERENCES "public"."comfort_criteria"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_submitted_by_users_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "outbox_due_idx" ON "outbox" USING btree ("next_attempt_at") WHERE "outbox"."state" = 'pending';--> statement-breakpoint
CREATE INDEX "outbox_sign_off_idx" ON "outbox" USING btree ("sign_off_id");--> statement-breakpoint
CREATE INDEX "sign_offs_project_idx" ON "sign_offs" USING btree ("project_id","submitted_at");--> statement-breakpoint
CREATE INDEX "sign_offs_variant_idx" ON "sign_offs" USING btree ("variant_id");--> statement-breakpoint
CREATE INDEX "sign_offs_criteria_idx" ON "sign_offs" USING btree ("criteria_id");--> statement-breakpoint
CREATE UNIQUE INDEX "sign_offs_one_submitted_per_variant" ON "sign_offs" USING btree ("variant_id") WHERE "sign_offs"."status" = 'submitted';