CREATE TABLE "sign_in_attempts" (
	"key" text PRIMARY KEY NOT NULL,
	"count" integer NOT NULL,
	"window_started_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "session_generation" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE INDEX "sign_in_attempts_window_idx" ON "sign_in_attempts" USING btree ("window_started_at");