ALTER TABLE "class_run" ADD COLUMN "hide_exact_until_prove" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "class_run" ADD COLUMN "discussion_prompts" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "class_run" ADD COLUMN "exit_ticket" text DEFAULT '' NOT NULL;