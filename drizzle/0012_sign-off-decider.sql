ALTER TABLE "sign_offs" ADD COLUMN "decided_by_name" text;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD COLUMN "decided_by_email" text;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD COLUMN "decided_project_name" text;