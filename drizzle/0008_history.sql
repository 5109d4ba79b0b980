CREATE TABLE "history_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"seq" bigint GENERATED ALWAYS AS IDENTITY (sequence name "history_events_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"project_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_id" uuid,
	"actor_name" text,
	"actor_email" text,
	"entity" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"label" text,
	"action" text NOT NULL,
	"changes" jsonb NOT NULL,
	"transaction_id" bigint DEFAULT txid_current() NOT NULL,
	CONSTRAINT "history_events_changes_is_object" CHECK (jsonb_typeof("history_events"."changes") = 'object')
);
--> statement-breakpoint
ALTER TABLE "history_events" ADD CONSTRAINT "history_events_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "history_events" ADD CONSTRAINT "history_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "history_events_project_at_idx" ON "history_events" USING btree ("project_id","at" DESC NULLS LAST,"seq" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "history_events_transaction_entity_idx" ON "history_events" USING btree ("transaction_id","entity_id");